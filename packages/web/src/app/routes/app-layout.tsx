import { makeStyles, tokens } from '@fluentui/react-components';
import { useState } from 'react';
import { Navigate, Outlet, useLocation, useNavigate, useOutletContext } from 'react-router-dom';
import { AppHeader } from '@/components/app-header';
import { Loading, RequestFailed } from '@/components/request-state';
import { RouterLink } from '@/components/router-link';
import { paths } from '@/config/paths';
import { useMe, type Me, type TeamMembership } from '@/features/auth/api/get-me';
import { useSignOut } from '@/features/auth/api/sign-out';
import { ApiError } from '@/lib/api-client';

const TEAM_STORAGE_KEY = 'limbus.currentTeamId';

export interface SignedInContext {
  me: Me;
  team: TeamMembership | null;
}

export function useSignedIn(): SignedInContext {
  return useOutletContext<SignedInContext>();
}

const useStyles = makeStyles({
  skip: {
    position: 'absolute',
    left: '-10000px',
    ':focus': { left: tokens.spacingHorizontalS, top: tokens.spacingVerticalS, zIndex: 10 },
  },
  main: { padding: tokens.spacingHorizontalL, maxWidth: '1200px', margin: '0 auto', boxSizing: 'border-box' },
  centered: { padding: tokens.spacingHorizontalXXL },
});

function readStoredTeamId(): string | null {
  try {
    return window.localStorage.getItem(TEAM_STORAGE_KEY);
  } catch {
    return null;
  }
}

/** Everything behind sign-in: loads the user once, picks the team, and frames the page. */
export function AppLayout() {
  const styles = useStyles();
  const location = useLocation();
  const navigate = useNavigate();
  const signOut = useSignOut(() => navigate(paths.signIn, { replace: true }));
  // Signing out clears the cache while this layout is still on screen; without the pause the account
  // would be fetched once more, token-less, on the way to the sign-in page.
  const me = useMe({ enabled: signOut.isIdle });
  const [chosenTeamId, setChosenTeamId] = useState<string | null>(readStoredTeamId);

  if (me.isPending) {
    return (
      <div className={styles.centered}>
        <Loading label="Loading your account…" />
      </div>
    );
  }
  if (me.isError) {
    if (me.error instanceof ApiError && me.error.status === 401) {
      const next = `${location.pathname}${location.search}`;
      return <Navigate to={`${paths.signIn}?next=${encodeURIComponent(next)}`} replace />;
    }
    return (
      <div className={styles.centered}>
        <RequestFailed what="your account" error={me.error} onRetry={() => void me.refetch()} />
      </div>
    );
  }

  const team = me.data.teams.find((t) => t.id === chosenTeamId) ?? me.data.teams[0] ?? null;
  const chooseTeam = (teamId: string) => {
    setChosenTeamId(teamId);
    try {
      window.localStorage.setItem(TEAM_STORAGE_KEY, teamId);
    } catch {
      // Private windows may refuse storage; the choice then lasts for this page only.
    }
  };
  const context: SignedInContext = { me: me.data, team };

  return (
    <>
      <a href="#main" className={styles.skip}>
        Skip to content
      </a>
      <AppHeader
        userName={me.data.name}
        isAdmin={me.data.isAdmin}
        teams={me.data.teams}
        currentTeamId={team?.id ?? null}
        onTeamChange={chooseTeam}
        onSignOut={() => signOut.mutate()}
        signingOut={signOut.isPending}
        nav={
          <>
            <RouterLink to={paths.events}>Events</RouterLink>
            <RouterLink to={paths.bodies}>Bodies</RouterLink>
            <RouterLink to={paths.team}>Team</RouterLink>
            {me.data.isAdmin ? <RouterLink to={paths.adminOutbox}>Outbox</RouterLink> : null}
          </>
        }
        accountLink={<RouterLink to={paths.account}>Account</RouterLink>}
      />
      <main id="main" className={styles.main} tabIndex={-1}>
        <Outlet context={context} />
      </main>
    </>
  );
}
