import { useNavigate, useParams } from 'react-router-dom';
import { AuthCard } from '@/components/auth-card';
import { RouterLink } from '@/components/router-link';
import { paths } from '@/config/paths';
import { AcceptInvitation } from '@/features/invitations/components/accept-invitation';

export function InvitationRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  return (
    <AuthCard title="Join a team">
      <AcceptInvitation
        token={token}
        onAccepted={() => navigate(paths.events, { replace: true })}
        forgotPasswordLink={<RouterLink to={paths.forgotPassword}>Forgot your password?</RouterLink>}
      />
    </AuthCard>
  );
}
