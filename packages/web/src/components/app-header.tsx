import { Button, makeStyles, Select, Text, tokens, useId } from '@fluentui/react-components';
import { SignOutRegular } from '@fluentui/react-icons';
import type { ReactNode } from 'react';
import { LimbusLogo } from './logo';
import { PRODUCT_NAME } from '@/config/product';

export interface HeaderTeam {
  id: string;
  name: string;
  roles: string[];
}

export interface AppHeaderProps {
  userName: string;
  isAdmin: boolean;
  teams: HeaderTeam[];
  currentTeamId: string | null;
  onTeamChange: (teamId: string) => void;
  onSignOut: () => void;
  signingOut?: boolean;
  nav: ReactNode;
  /** The link to the user's own account page, shown with their name. */
  accountLink: ReactNode;
}

const useStyles = makeStyles({
  header: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalL,
    padding: `${tokens.spacingVerticalS} ${tokens.spacingHorizontalL}`,
    backgroundColor: tokens.colorBrandBackground2,
    borderBottom: `1px solid ${tokens.colorNeutralStroke2}`,
  },
  brand: {
    display: 'flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
    fontWeight: tokens.fontWeightBold,
    fontSize: tokens.fontSizeBase500,
  },
  nav: { display: 'flex', gap: tokens.spacingHorizontalM, flexWrap: 'wrap' },
  spacer: { flexGrow: 1 },
  user: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM, flexWrap: 'wrap' },
  who: { display: 'flex', flexDirection: 'column' },
  team: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalS },
});

export function rolesLabel(isAdmin: boolean, team: HeaderTeam | undefined): string {
  const roles = [...(isAdmin ? ['site admin'] : []), ...(team?.roles ?? [])];
  return roles.length === 0 ? 'no role' : roles.join(', ');
}

export function AppHeader(props: AppHeaderProps) {
  const styles = useStyles();
  const teamSelectId = useId('team');
  const currentTeam = props.teams.find((team) => team.id === props.currentTeamId) ?? props.teams[0];
  return (
    <header className={styles.header}>
      <div className={styles.brand}>
        <LimbusLogo sizePx={32} decorative />
        {PRODUCT_NAME}
      </div>
      <nav className={styles.nav} aria-label="Main">
        {props.nav}
      </nav>
      <div className={styles.spacer} />
      <div className={styles.user}>
        {props.teams.length > 1 ? (
          <div className={styles.team}>
            <label htmlFor={teamSelectId}>Team</label>
            <Select
              id={teamSelectId}
              value={currentTeam?.id ?? ''}
              onChange={(_, data) => props.onTeamChange(data.value)}
            >
              {props.teams.map((team) => (
                <option key={team.id} value={team.id}>
                  {team.name}
                </option>
              ))}
            </Select>
          </div>
        ) : currentTeam !== undefined ? (
          <Text>{currentTeam.name}</Text>
        ) : null}
        <div className={styles.who}>
          <Text weight="semibold" data-testid="user-name">
            {props.userName}
          </Text>
          <Text size={200} data-testid="user-roles">
            {rolesLabel(props.isAdmin, currentTeam)}
          </Text>
        </div>
        {props.accountLink}
        <Button icon={<SignOutRegular />} onClick={props.onSignOut} disabled={props.signingOut}>
          Sign out
        </Button>
      </div>
    </header>
  );
}
