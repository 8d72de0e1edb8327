import { Injectable } from '@nestjs/common';
import type { EventDetail } from './events.service';

/** Enough for every event a busy team has open; one ordinary entry is tens of kilobytes. */
const MAX_ENTRIES = 500;
/**
 * Rows (stations, chords, ring events) kept in all entries together, about 1 kB of memory each: an event
 * at its size limits holds 9,000, so a few large events cannot fill a process's memory.
 */
const MAX_ROWS = 100_000;
/** Data hashes are 64 characters: the list of events reads them for many more events than the desk opens. */
const MAX_HASHES = 20_000;

function rowsOf(detail: EventDetail): number {
  return 1 + detail.stations.length + detail.chords.length + detail.ringEvents.length;
}

/**
 * The detail view of recently read events, each under the `events.revision` it was built at. The
 * revision is kept by database triggers on every write to the event and its stations, chords and
 * ring events, so a caller that reads the current revision first never gets an older view, whichever
 * process wrote. Entries are frozen: a caller that wants to change one must copy it. Each view's data
 * hash is kept apart for longer, so the events list does not rebuild a large event's view to show it.
 */
@Injectable()
export class EventDetailCache {
  private readonly entries = new Map<string, { revision: number; detail: EventDetail; rows: number }>();
  private readonly hashes = new Map<string, { revision: number; dataSha256: string }>();
  private rows = 0;

  get(eventId: string, revision: number): EventDetail | undefined {
    const entry = this.entries.get(eventId);
    if (entry?.revision !== revision) return undefined;
    // Map order is insertion order: re-inserting makes this the most recently used.
    this.entries.delete(eventId);
    this.entries.set(eventId, entry);
    return entry.detail;
  }

  set(eventId: string, revision: number, detail: EventDetail): void {
    this.remove(eventId);
    const rows = rowsOf(detail);
    this.entries.set(eventId, { revision, detail: deepFreeze(detail), rows });
    this.rows += rows;
    while (this.entries.size > MAX_ENTRIES || (this.rows > MAX_ROWS && this.entries.size > 1)) {
      const oldest = this.entries.keys().next().value;
      if (oldest === undefined) break;
      this.remove(oldest);
    }
    this.setDataSha256(eventId, revision, detail.dataSha256);
  }

  /** The data hash of the event at that revision, kept even after its view was dropped. */
  dataSha256(eventId: string, revision: number): string | undefined {
    const entry = this.hashes.get(eventId);
    return entry?.revision === revision ? entry.dataSha256 : undefined;
  }

  /** How many rows the kept views hold together (for tests and measurements). */
  get keptRows(): number {
    return this.rows;
  }

  private setDataSha256(eventId: string, revision: number, dataSha256: string): void {
    this.hashes.delete(eventId);
    this.hashes.set(eventId, { revision, dataSha256 });
    if (this.hashes.size > MAX_HASHES) {
      const oldest = this.hashes.keys().next().value;
      if (oldest !== undefined) this.hashes.delete(oldest);
    }
  }

  private remove(eventId: string): void {
    const entry = this.entries.get(eventId);
    if (entry === undefined) return;
    this.entries.delete(eventId);
    this.rows -= entry.rows;
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
