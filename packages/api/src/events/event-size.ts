// The size limits of one event (EVENT_SIZE_LIMITS in @limbus/schema), on every route that adds stations,
// chords or ring events. The check locks the event's row first, so two adds that meet are counted one
// after the other and never pass the limit together; the revision triggers take that lock anyway.
import type { EntityManager } from '@mikro-orm/mariadb';
import { EVENT_SIZE_LIMITS, eventSizeMessage } from '@limbus/schema';
import { NotFoundError, ValidationError } from '../common/domain-errors';

export type EventPart = keyof typeof EVENT_SIZE_LIMITS;

const TABLES: Record<EventPart, string> = {
  stations: 'stations',
  chords: 'chords',
  ringEvents: 'ring_events',
};

/**
 * Inside the caller's transaction: locks the event's row, then refuses (400 naming the part and the
 * limit) when adding `adding[part]` rows would pass a limit. `removing` counts rows the same transaction
 * deletes before it adds (a report's ring events replaced by its new dips).
 */
export async function assertEventRoom(
  em: EntityManager,
  eventId: string,
  adding: Partial<Record<EventPart, number>>,
  removing: Partial<Record<EventPart, number>> = {},
): Promise<void> {
  if (!em.isInTransaction()) throw new Error('assertEventRoom() must run inside a transaction');
  const [locked] = await em.execute<Array<{ id: string }>>(
    'select `id` from `events` where `id` = ? for update',
    [eventId],
  );
  if (!locked) throw new NotFoundError();
  const issues = [];
  for (const [part, n] of Object.entries(adding) as Array<[EventPart, number]>) {
    if (n <= 0) continue;
    const [row] = await em.execute<Array<{ n: number | string }>>(
      `select count(*) as n from \`${TABLES[part]}\` where \`event_id\` = ?`,
      [eventId],
    );
    const would = Number(row?.n ?? 0) - (removing[part] ?? 0) + n;
    if (would > EVENT_SIZE_LIMITS[part]) issues.push({ path: part, message: eventSizeMessage(part, would) });
  }
  if (issues.length > 0) throw new ValidationError(issues);
}
