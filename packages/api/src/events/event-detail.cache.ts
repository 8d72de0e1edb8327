import { Injectable } from '@nestjs/common';
import type { EventDetail } from './events.service';

/** Enough for every event a busy team has open; one entry is tens of kilobytes. */
const MAX_ENTRIES = 500;

/**
 * The detail view of recently read events, each under the `events.revision` it was built at. The
 * revision is kept by database triggers on every write to the event and its stations, chords and
 * ring events, so a caller that reads the current revision first never gets an older view, whichever
 * process wrote. Entries are frozen: a caller that wants to change one must copy it.
 */
@Injectable()
export class EventDetailCache {
  private readonly entries = new Map<string, { revision: number; detail: EventDetail }>();

  get(eventId: string, revision: number): EventDetail | undefined {
    const entry = this.entries.get(eventId);
    if (entry?.revision !== revision) return undefined;
    // Map order is insertion order: re-inserting makes this the most recently used.
    this.entries.delete(eventId);
    this.entries.set(eventId, entry);
    return entry.detail;
  }

  set(eventId: string, revision: number, detail: EventDetail): void {
    this.entries.delete(eventId);
    this.entries.set(eventId, { revision, detail: deepFreeze(detail) });
    if (this.entries.size > MAX_ENTRIES) {
      const oldest = this.entries.keys().next().value;
      if (oldest !== undefined) this.entries.delete(oldest);
    }
  }
}

/** Freezes a view and everything in it, so a cached value cannot be changed by a caller. */
export function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const child of Object.values(value)) deepFreeze(child);
  }
  return value;
}
