import { Body1, makeStyles, MessageBar, MessageBarBody, tokens } from '@fluentui/react-components';
import { useSendBriefings } from '../api/send-briefings';
import { ConfirmButton } from '@/components/confirm-button';

const useStyles = makeStyles({
  panel: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS, alignItems: 'start' },
});

export interface SendBriefingProps {
  eventId: string;
  /** The event's stations, to count whom the e-mails reach. */
  stations: ReadonlyArray<{ code: string; observerId?: string | null }>;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * A coordinator e-mails every observer with a station their own briefing, after a confirmation that
 * names how many observers it reaches (and which stations it cannot, having no observer account).
 */
export function SendBriefing({ eventId, stations }: SendBriefingProps) {
  const styles = useStyles();
  const send = useSendBriefings(eventId);
  const observers = new Set(stations.flatMap((s) => (s.observerId ? [s.observerId] : [])));
  const unreachable = stations.filter((s) => !s.observerId).map((s) => s.code);
  const count = plural(observers.size, 'observer');
  return (
    <div className={styles.panel}>
      {observers.size === 0 ? (
        <Body1 as="p">No station has an observer with an account yet, so no briefing can be sent.</Body1>
      ) : (
        <ConfirmButton
          size="medium"
          text="Send the briefing to every observer…"
          name="Send the briefing to every observer"
          title={`Send the briefing to ${count}?`}
          description={`Each of the ${count} with a station gets an e-mail with their own stations' predicted times and their ±, the watch window, the pointing, a link to this event, and the safety cautions.${
            unreachable.length === 0
              ? ''
              : ` ${plural(unreachable.length, 'station')} without an observer account (${unreachable.join(', ')}) ${unreachable.length === 1 ? 'gets' : 'get'} none.`
          }`}
          confirmText={`Send to ${count}`}
          pending={send.isPending}
          error={send.error}
          onOpen={() => send.reset()}
          onConfirm={(close) => send.mutate(undefined, { onSuccess: close })}
        />
      )}
      {send.isSuccess ? (
        <MessageBar intent="success" layout="multiline">
          <MessageBarBody role="status">
            Briefing sent to{' '}
            {send.data.sent.length === 0
              ? 'nobody'
              : send.data.sent.map((s) => `${s.name} (${s.stations.join(', ')})`).join('; ')}
            .
            {send.data.withoutObserver.length === 0
              ? ''
              : ` Not reached, no observer account: ${send.data.withoutObserver.join(', ')}.`}
          </MessageBarBody>
        </MessageBar>
      ) : null}
      {send.isSuccess && send.data.failed.length > 0 ? (
        <MessageBar intent="error" layout="multiline">
          <MessageBarBody role="alert">
            The mail server did not take the briefing of{' '}
            {send.data.failed.map((f) => `${f.name} (${f.reason})`).join('; ')}: send it again later.
          </MessageBarBody>
        </MessageBar>
      ) : null}
    </div>
  );
}
