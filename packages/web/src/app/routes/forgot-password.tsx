import { AuthCard } from '@/components/auth-card';
import { RouterLink } from '@/components/router-link';
import { paths } from '@/config/paths';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';

export function ForgotPasswordRoute() {
  return (
    <AuthCard title="Forgot your password?">
      <ForgotPasswordForm />
      <RouterLink to={paths.signIn}>Back to sign-in</RouterLink>
    </AuthCard>
  );
}
