import { Body1 } from '@fluentui/react-components';
import { useSignedIn } from './app-layout';
import { Outbox } from '@/features/admin/components/outbox';

export function AdminOutboxRoute() {
  const { me } = useSignedIn();
  // The server refuses non-admins too; this only spares them a request that cannot succeed.
  if (!me.isAdmin) return <Body1 as="p">The outbox is for site admins.</Body1>;
  return <Outbox />;
}
