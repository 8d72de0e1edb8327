import { Button, makeStyles, tokens } from '@fluentui/react-components';
import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { useSignedIn } from './app-layout';
import { paths } from '@/config/paths';
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
  // Creating an event is the coordinators' and modellers' work (the server checks the same roles).
  const canCreate = me.isAdmin || (team?.roles ?? []).some((r) => r === 'coordinator' || r === 'modeller');
  return (
    <div className={styles.page}>
      <EventsList teamId={team?.id ?? null} teamName={team?.name ?? null} />
      {canCreate ? (
        <Button className={styles.toggle} aria-expanded={adding} onClick={() => setAdding((a) => !a)}>
          {adding ? 'Close new event' : 'New event…'}
        </Button>
      ) : null}
      {canCreate && adding ? (
        <NewEvent teamId={team?.id ?? null} onDone={(eventId) => navigate(paths.event(eventId))} />
      ) : null}
    </div>
  );
}
