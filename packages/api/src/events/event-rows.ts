// Between the event file (limbus-event/1) and the stored rows: an import writes the rows of one
// file, an export or a fit snapshot reads them back into a file. Positions keep the file's order so
// that a round trip gives an equal file.
import type { EntityManager } from '@mikro-orm/mariadb';
import type {
  ChordInput,
  EventInput,
  PredictionSettings,
  RingEventInput,
  StationInput,
} from '@limbus/geometry';
import { EVENT_FORMAT } from '@limbus/schema';
import { Chord, type ChordSource } from '../chords/entities/chord.entity';
import { RingEvent } from '../chords/entities/ring-event.entity';
import type { Body } from '../bodies/entities/body.entity';
import { Station } from '../stations/entities/station.entity';
import type { Team } from '../teams/entities/team.entity';
import { OccultationEvent } from './entities/occultation-event.entity';
import { defaultEventTimeUtc } from './event-data';

export interface EventRows {
  event: OccultationEvent;
  stations: Station[];
  chords: Chord[];
  ringEvents: RingEvent[];
}

export function chordRow(
  event: OccultationEvent,
  station: Station,
  input: ChordInput,
  source: ChordSource,
  position: number,
): Chord {
  const chord = new Chord(event, station, input.type, source);
  applyChordInput(chord, station, input);
  chord.position = position;
  return chord;
}

export function applyChordInput(chord: Chord, station: Station, input: ChordInput): void {
  chord.station = station;
  chord.type = input.type;
  chord.timeOffsetSeconds = input.timeOffsetSeconds;
  if (input.type === 'positive') {
    // A single-edge chord stores null for the edge it does not give.
    chord.disappearance = input.disappearance ? { ...input.disappearance } : null;
    chord.reappearance = input.reappearance ? { ...input.reappearance } : null;
    chord.startUtc = null;
    chord.endUtc = null;
  } else {
    chord.disappearance = null;
    chord.reappearance = null;
    chord.startUtc = input.start;
    chord.endUtc = input.end;
  }
}

/** Persists (does not flush) every row of a validated event file. */
export function persistEventFile(
  em: EntityManager,
  team: Team,
  body: Body,
  file: EventInput,
  createdById: string | null,
): EventRows {
  const event = new OccultationEvent(team, body, {
    title: file.title,
    eventTimeUtc: defaultEventTimeUtc(file),
    star: file.star,
    ephemeris: file.ephemeris,
    earthRotation: file.earthRotation,
    fitDefaults: file.fit,
  });
  event.createdById = createdById;
  em.persist(event);
  const byCode = new Map<string, Station>();
  const stations = file.stations.map((s, i) => {
    const station = new Station(event, {
      code: s.id,
      latDeg: s.latDeg,
      lonDeg: s.lonDeg,
      heightM: s.heightM,
    });
    station.position = i;
    byCode.set(s.id, station);
    return station;
  });
  const stationOf = (code: string): Station => {
    const station = byCode.get(code);
    // validateEventFile has checked every reference; reaching this is a bug, not bad input.
    if (!station) throw new Error(`event file refers to unknown station ${code}`);
    return station;
  };
  const chords = file.chords.map((c, i) => chordRow(event, stationOf(c.station), c, 'import', i));
  const ringEvents = file.ringEvents.map((r, i) => {
    const ring = new RingEvent(event, stationOf(r.station), r);
    ring.position = i;
    return ring;
  });
  em.persist([...stations, ...chords, ...ringEvents]);
  return { event, stations, chords, ringEvents };
}

export async function loadEventRows(em: EntityManager, event: OccultationEvent): Promise<EventRows> {
  const [stations, chords, ringEvents] = await Promise.all([
    em.find(Station, { event }, { orderBy: { position: 'asc', code: 'asc' } }),
    em.find(Chord, { event }, { orderBy: { position: 'asc', createdAt: 'asc', id: 'asc' } }),
    em.find(RingEvent, { event }, { orderBy: { position: 'asc', id: 'asc' } }),
  ]);
  return { event, stations, chords, ringEvents };
}

export function stationInput(s: Station): StationInput {
  return { id: s.code, latDeg: s.latDeg, lonDeg: s.lonDeg, heightM: s.heightM };
}

export function chordInput(c: Chord): ChordInput {
  if (c.type === 'positive') {
    // Every route writes a positive chord through the event file's chord schema, which needs one edge.
    if (!c.disappearance && !c.reappearance) throw new Error(`positive chord ${c.id} has neither edge`);
    return {
      station: c.station.code,
      type: 'positive',
      ...(c.disappearance ? { disappearance: { ...c.disappearance } } : {}),
      ...(c.reappearance ? { reappearance: { ...c.reappearance } } : {}),
      timeOffsetSeconds: c.timeOffsetSeconds,
    };
  }
  if (!c.startUtc || !c.endUtc) throw new Error(`negative chord ${c.id} lacks its span`);
  return {
    station: c.station.code,
    type: 'negative',
    start: c.startUtc,
    end: c.endUtc,
    timeOffsetSeconds: c.timeOffsetSeconds,
  };
}

export function ringEventInput(r: RingEvent): RingEventInput {
  return {
    station: r.station.code,
    ring: r.ring,
    start: { ...r.start },
    end: { ...r.end },
    ...(r.apparentOpacity ? { apparentOpacity: { ...r.apparentOpacity } } : {}),
  };
}

/**
 * The event file of the stored rows, with `fit` as given (the defaults, or a fit's overlaid options): the
 * file fits run on and the event's data hash covers. Sites planned ahead or proposed by an observer are not
 * the fit's, so only observing stations are listed, with any other that a chord or ring event names.
 */
export function eventFileOf(rows: EventRows, fit = rows.event.fitDefaults): EventInput {
  const e = rows.event;
  const named = new Set([...rows.chords, ...rows.ringEvents].map((row) => row.station.id));
  return {
    format: EVENT_FORMAT,
    title: e.title,
    star: e.star,
    ephemeris: e.ephemeris,
    earthRotation: e.earthRotation,
    stations: rows.stations.filter((s) => s.status === 'observing' || named.has(s.id)).map(stationInput),
    chords: rows.chords.map(chordInput),
    ringEvents: rows.ringEvents.map(ringEventInput),
    fit,
  };
}

/**
 * The whole event file, as the export gives it and the prediction reads it: every station whatever its
 * status (a prediction lists planned and proposed sites too), the prediction section when the event has one.
 */
export function planningFileOf(rows: EventRows): EventInput & { prediction?: PredictionSettings } {
  const { prediction } = rows.event;
  return {
    ...eventFileOf(rows),
    stations: rows.stations.map(stationInput),
    ...(prediction === null ? {} : { prediction }),
  };
}
