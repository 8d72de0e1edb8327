import type { DipOpacity, TimedMark } from '@limbus/geometry';
import type { StationStatus } from '@limbus/schema';
import type { Chord, ChordSource } from '../chords/entities/chord.entity';
import type { RingEvent } from '../chords/entities/ring-event.entity';
import type { Station } from '../stations/entities/station.entity';

export interface StationView {
  id: string;
  code: string;
  latDeg: number;
  lonDeg: number;
  heightM: number;
  observerId: string | null;
  observerName: string | null;
  apertureMm: number | null;
  camera: string | null;
  exposureSeconds: number | null;
  timeSource: string | null;
  /** observing, planned (placed ahead) or proposed (an observer's site awaiting the coordinator). */
  status: StationStatus;
  notes: string | null;
}

export function stationView(s: Station): StationView {
  return {
    id: s.id,
    code: s.code,
    latDeg: s.latDeg,
    lonDeg: s.lonDeg,
    heightM: s.heightM,
    observerId: s.observer?.id ?? null,
    observerName: s.observerName,
    apertureMm: s.apertureMm,
    camera: s.camera,
    exposureSeconds: s.exposureSeconds,
    timeSource: s.timeSource,
    status: s.status,
    notes: s.notes,
  };
}

export interface ChordView {
  id: string;
  station: string;
  stationId: string;
  type: 'positive' | 'negative';
  disappearance: TimedMark | null;
  reappearance: TimedMark | null;
  start: string | null;
  end: string | null;
  timeOffsetSeconds: number;
  source: ChordSource;
  /** With source "timing": the light-curve timing whose D and R the chord holds. */
  timingId: string | null;
  reportId: string | null;
}

export function chordView(c: Chord): ChordView {
  return {
    id: c.id,
    station: c.station.code,
    stationId: c.station.id,
    type: c.type,
    disappearance: c.disappearance,
    reappearance: c.reappearance,
    start: c.startUtc,
    end: c.endUtc,
    timeOffsetSeconds: c.timeOffsetSeconds,
    source: c.source,
    timingId: c.timing?.id ?? null,
    reportId: c.report?.id ?? null,
  };
}

export interface RingEventView {
  id: string;
  station: string;
  stationId: string;
  ring: string;
  start: TimedMark;
  end: TimedMark;
  /** The dip's apparent opacity from its light curve, or null (docs/file-formats.md, "Event file"). */
  apparentOpacity: DipOpacity | null;
  reportId: string | null;
}

export function ringEventView(r: RingEvent): RingEventView {
  return {
    id: r.id,
    station: r.station.code,
    stationId: r.station.id,
    ring: r.ring,
    start: r.start,
    end: r.end,
    apparentOpacity: r.apparentOpacity,
    reportId: r.report?.id ?? null,
  };
}
