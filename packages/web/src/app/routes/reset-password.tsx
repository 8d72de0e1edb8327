import { useParams } from 'react-router-dom';
import { AuthCard } from '@/components/auth-card';
import { RouterLink } from '@/components/router-link';
import { paths } from '@/config/paths';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';

export function ResetPasswordRoute() {
  const { token = '' } = useParams();
  return (
    <AuthCard title="Choose a new password">
      <ResetPasswordForm token={token} signInLink={<RouterLink to={paths.signIn}>Sign in</RouterLink>} />
    </AuthCard>
  );
}
