import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import type { TimedMark } from '@limbus/geometry';
import { OccultationEvent } from '../../events/entities/occultation-event.entity';
import { Report } from '../../reports/entities/report.entity';
import { Station } from '../../stations/entities/station.entity';

export const CHORD_SOURCES = ['import', 'report', 'manual', 'csv'] as const;
export type ChordSource = (typeof CHORD_SOURCES)[number];

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
