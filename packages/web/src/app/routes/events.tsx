import { useSignedIn } from './app-layout';
import { EventsList } from '@/features/events/components/events-list';

export function EventsRoute() {
  const { team } = useSignedIn();
  return <EventsList teamId={team?.id ?? null} teamName={team?.name ?? null} />;
}
