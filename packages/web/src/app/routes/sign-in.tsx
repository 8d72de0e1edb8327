import { makeStyles } from '@fluentui/react-components';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { AuthCard } from '@/components/auth-card';
import { RouterLink } from '@/components/router-link';
import { paths } from '@/config/paths';
import { SignInForm } from '@/features/auth/components/sign-in-form';

const useStyles = makeStyles({ links: { marginTop: '12px' } });

// Only same-site paths are followed after sign-in, so a crafted link cannot bounce the user elsewhere.
function safeNext(next: string | null): string {
  return next !== null && next.startsWith('/') && !next.startsWith('//') ? next : paths.events;
}

export function SignInRoute() {
  const styles = useStyles();
  const navigate = useNavigate();
  const [search] = useSearchParams();
  return (
    <AuthCard title="Sign in">
      <SignInForm onSignedIn={() => navigate(safeNext(search.get('next')), { replace: true })} />
      <div className={styles.links}>
        <RouterLink to={paths.forgotPassword}>Forgot your password?</RouterLink>
      </div>
    </AuthCard>
  );
}
