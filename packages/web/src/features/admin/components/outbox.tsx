import { Button, makeStyles, Title3, tokens } from '@fluentui/react-components';
import { useOutbox } from '../api/get-outbox';
import { OutboxTable } from './outbox-table';
import { Loading, RequestFailed } from '@/components/request-state';

const useStyles = makeStyles({
  heading: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM, flexWrap: 'wrap' },
});

export function Outbox() {
  const styles = useStyles();
  const outbox = useOutbox();
  return (
    <section aria-labelledby="outbox-heading">
      <div className={styles.heading}>
        <Title3 as="h2" id="outbox-heading">
          Outbox
        </Title3>
        <Button onClick={() => void outbox.refetch()} disabled={outbox.isFetching}>
          Refresh
        </Button>
      </div>
      {outbox.isPending ? (
        <Loading label="Loading captured e-mails…" />
      ) : outbox.isError ? (
        <RequestFailed what="the outbox" error={outbox.error} onRetry={() => void outbox.refetch()} />
      ) : (
        <OutboxTable messages={outbox.data} />
      )}
    </section>
  );
}
