import { Body1 } from '@fluentui/react-components';
import { waitingForTiming, type Report } from '../api/get-reports';
import { useDecideReport } from '../api/review-report';
import { AcceptOrReject } from './accept-or-reject';

/** A coordinator's accept or reject of a report; an accept that would replace better times asks first. */
export function DecideReport({ eventId, report }: { eventId: string; report: Report }) {
  const decide = useDecideReport(eventId);
  return (
    <AcceptOrReject
      who={`report of ${report.authorName}`}
      pending={decide.isPending}
      error={decide.error}
      acceptInstead={
        waitingForTiming(report) ? (
          <Body1>
            Time its light curve in the Light curves section; accepting the timing accepts the report.
          </Body1>
        ) : undefined
      }
      onAccept={(replaceTimedChord) =>
        decide.mutate({ reportId: report.id, accept: true, replaceTimedChord })
      }
      onReject={(reason) => decide.mutate({ reportId: report.id, accept: false, reason })}
      onKeep={() => decide.reset()}
    />
  );
}
