import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import type { TimedMark } from '@limbus/geometry';
import { CHORD_SOURCE_VALUES, type ChordSourceValue } from '@limbus/schema';
import { OccultationEvent } from '../../events/entities/occultation-event.entity';
import { Report } from '../../reports/entities/report.entity';
import { Station } from '../../stations/entities/station.entity';
import { LightCurveTiming } from '../../timings/entities/light-curve-timing.entity';

/** Where a chord's times came from: an event file, a typed report, a light-curve timing, a form, a CSV. */
export const CHORD_SOURCES = CHORD_SOURCE_VALUES;
export type ChordSource = ChordSourceValue;

/** What the fit uses: positive chords carry D and R, negative ones the span watched. */
@Entity({ tableName: 'chords' })
export class Chord {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => OccultationEvent, deleteRule: 'cascade' })
  event: OccultationEvent;

  @ManyToOne({ entity: () => Station, deleteRule: 'cascade' })
  station: Station;

  @Property({ type: 'string', length: 16 })
  type: 'positive' | 'negative';

  @Property({ type: 'json', nullable: true })
  disappearance: (TimedMark & Opt) | null = null;

  @Property({ type: 'json', nullable: true })
  reappearance: (TimedMark & Opt) | null = null;

  @Property({ type: 'string', length: 40, nullable: true })
  startUtc: (string & Opt) | null = null;

  @Property({ type: 'string', length: 40, nullable: true })
  endUtc: (string & Opt) | null = null;

  @Property({ type: 'double' })
  timeOffsetSeconds: number & Opt = 0;

  @Property({ type: 'string', length: 16 })
  source: ChordSource;

  /** With source "timing": the light-curve timing whose D and R the chord holds. */
  @ManyToOne({ entity: () => LightCurveTiming, nullable: true, deleteRule: 'set null' })
  timing: (LightCurveTiming & Opt) | null = null;

  /** The accepted report this chord came from; accepting it again updates this chord. */
  @ManyToOne({ entity: () => Report, nullable: true, deleteRule: 'set null', unique: true })
  report: (Report & Opt) | null = null;

  @Property({ type: 'integer' })
  position: number & Opt = 0;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', onUpdate: () => new Date() })
  updatedAt: Date & Opt = new Date();

  constructor(event: OccultationEvent, station: Station, type: 'positive' | 'negative', source: ChordSource) {
    this.event = event;
    this.station = station;
    this.type = type;
    this.source = source;
  }
}
