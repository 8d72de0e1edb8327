import { Button, makeStyles, tokens } from '@fluentui/react-components';
import type { TeamRole } from '@limbus/schema/team';
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useSignedIn } from './app-layout';
import { paths } from '@/config/paths';
import { useBodies } from '@/features/bodies/api/get-bodies';
import { EventsList } from '@/features/events/components/events-list';
import { NewEvent } from '@/features/events/components/new-event';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL, alignItems: 'stretch' },
  toggle: { alignSelf: 'start' },
});

export function EventsRoute() {
  const styles = useStyles();
  const { me, team } = useSignedIn();
  const navigate = useNavigate();
  const [adding, setAdding] = useState(false);
  const bodies = useBodies(team?.id ?? null);
  const roles = team?.roles ?? [];
  // Site admins pass every role check on the server; the list offers them the same controls.
  const has = (...wanted: TeamRole[]) => me.isAdmin || wanted.some((r) => roles.includes(r));
  // Creating an event is the coordinators' work (the server checks the same role).
  const canCreate = has('coordinator');
  return (
    <div className={styles.page}>
      <EventsList
        teamId={team?.id ?? null}
        teamName={team?.name ?? null}
        bodies={bodies.data ?? []}
        canReview={has('reviewer')}
        canRestore={has('coordinator')}
        showOwnStations={roles.includes('observer')}
      />
      {canCreate ? (
        <Button className={styles.toggle} aria-expanded={adding} onClick={() => setAdding((a) => !a)}>
          {adding ? 'Close new event' : 'New event…'}
        </Button>
      ) : null}
      {canCreate && adding ? (
        <NewEvent
          teamId={team?.id ?? null}
          // A failed load leaves the chooser with "New body…" only; the server still checks the name.
          bodies={bodies.isError ? [] : (bodies.data ?? null)}
          onDone={(eventId) => navigate(paths.event(eventId))}
        />
      ) : null}
    </div>
  );
}
