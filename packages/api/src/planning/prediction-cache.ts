import { Injectable } from '@nestjs/common';
import type { EventInput, Prediction, PredictionSettings } from '@limbus/geometry';
import type { PredictionOffsetSource, StationStatus } from '@limbus/schema';
import { deepFreeze } from '../events/event-detail.cache';

/** One station as planning needs it beyond the event file: who observes there, and its status. */
export interface PlanningStation {
  id: string;
  code: string;
  status: StationStatus;
  observerId: string | null;
  observerName: string | null;
  latDeg: number;
  lonDeg: number;
  heightM: number;
}

/** The event's prediction and what it was computed from, at one revision of the event. */
export interface PlanningSnapshot {
  eventId: string;
  teamId: string;
  title: string;
  bodyName: string;
  eventTimeUtc: string;
  offsetSource: PredictionOffsetSource | null;
  stations: PlanningStation[];
  /** The event file as exported (every station), which `limbus predict` would read. */
  file: EventInput;
  settings: PredictionSettings;
  prediction: Prediction;
}

/** A prediction of a 200-station event is a few hundred kB; a few dozen events cover a busy night. */
const MAX_ENTRIES = 50;

/**
 * Predictions of recently read events, each under the `events.revision` it was computed at. The revision
 * rises with every write to the event (its prediction settings included) and its stations, chords and ring
 * events, so a caller that reads the current revision first never gets a prediction of older data.
 * Entries are frozen: callers copy what they change.
 */
@Injectable()
export class PredictionCache {
  private readonly entries = new Map<string, { revision: number; snapshot: PlanningSnapshot }>();

  get(eventId: string, revision: number): PlanningSnapshot | undefined {
    const entry = this.entries.get(eventId);
    if (entry?.revision !== revision) return undefined;
    this.entries.delete(eventId);
    this.entries.set(eventId, entry);
    return entry.snapshot;
  }

  set(eventId: string, revision: number, snapshot: PlanningSnapshot): void {
    this.entries.delete(eventId);
    this.entries.set(eventId, { revision, snapshot: deepFreeze(snapshot) });
    if (this.entries.size > MAX_ENTRIES) {
      const oldest = this.entries.keys().next().value;
      if (oldest !== undefined) this.entries.delete(oldest);
    }
  }
}
