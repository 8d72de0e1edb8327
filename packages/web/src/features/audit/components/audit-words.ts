import type { AuditEntryView } from '../api/get-event-audit';

// The server's audit actions in words, as a sentence after the actor: "Noor Calder accepted a report".
const ACTION_WORDS: Record<string, string> = {
  'event.import': 'imported the event',
  'event.create': 'created the event',
  'event.update': 'edited the event',
  'event.delete': 'archived the event',
  'event.restore': 'restored the event',
  'station.create': 'added a station',
  'station.update': 'edited a station',
  'station.delete': 'removed a station',
  'chord.create': 'added a chord',
  'chord.update': 'edited a chord',
  'chord.delete': 'deleted a chord',
  'chord.import': 'imported chords from a CSV file',
  'report.submit': 'submitted a report',
  'report.update': 'edited a report',
  'report.resubmit': 'submitted a rejected report again',
  'report.accept': 'accepted a report',
  'report.reject': 'rejected a report',
  'report.light-curve': 'uploaded a light curve',
  'report.correction.request': 'asked to correct an accepted report',
  'report.correction.accept': 'accepted a report correction',
  'report.correction.reject': 'rejected a report correction',
  'timing.create': 'started a light-curve timing',
  'timing.solved': 'light-curve timing finished',
  'timing.failed': 'light-curve timing failed',
  'timing.accept': 'accepted a timing into the chord',
  'timing.ring-events': 'added ring events from a timing',
  'fit.submit': 'ran a fit',
  'fit.solved': 'fit solved',
  'fit.failed': 'fit failed',
  'fit.review-request': 'asked for review of a fit',
  'fit.review.approve': 'approved a fit',
  'fit.review.return': 'returned a fit',
  'dynamics.put': "saved the body's physical parameters",
  'body.create': 'created the body',
  'body.update': 'edited the body',
  'body.delete': 'deleted the body',
};

/** An action the client does not know yet still reads as words: "report.correction.request" → "report correction request". */
export function actionText(action: string): string {
  return ACTION_WORDS[action] ?? action.replace(/[.-]/g, ' ');
}

const MAX_VALUE_CHARS = 60;

function valueText(value: unknown): string {
  if (typeof value === 'string') return value;
  if (typeof value === 'number' || typeof value === 'boolean' || value === null) return String(value);
  if (Array.isArray(value) && value.every((v) => typeof v === 'string' || typeof v === 'number'))
    return value.join(', ');
  return JSON.stringify(value);
}

/** The entry's detail on one line: "station kestrel-hill · type positive", each value cut short. */
export function detailText(detail: AuditEntryView['detail']): string {
  if (detail === null) return '';
  return Object.entries(detail)
    .map(([key, value]) => {
      const text = valueText(value);
      return `${key} ${text.length > MAX_VALUE_CHARS ? `${text.slice(0, MAX_VALUE_CHARS - 1)}…` : text}`;
    })
    .join(' · ');
}
