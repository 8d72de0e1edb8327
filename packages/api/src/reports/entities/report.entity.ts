import { randomUUID } from 'node:crypto';
import { Entity, Index, ManyToOne, Opt, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import type { TimedMark } from '@limbus/geometry';
import { OccultationEvent } from '../../events/entities/occultation-event.entity';
import { Station } from '../../stations/entities/station.entity';
import { Upload } from '../../uploads/entities/upload.entity';
import { User } from '../../users/entities/user.entity';

export const REPORT_RESULTS = ['positive', 'negative', 'clouded_out', 'technical_failure'] as const;
export type ReportResult = (typeof REPORT_RESULTS)[number];
export const REPORT_STATES = ['submitted', 'accepted', 'rejected'] as const;
export type ReportState = (typeof REPORT_STATES)[number];

export interface RingDip {
  ring: string;
  start: TimedMark;
  end: TimedMark;
}

/** What one observer submitted for one station; kept as submitted, whatever the coordinator decides. */
@Entity({ tableName: 'reports' })
@Index({ properties: ['event', 'author'] })
@Unique({ properties: ['station', 'openAuthorId'] })
export class Report {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => OccultationEvent, deleteRule: 'cascade' })
  event: OccultationEvent;

  @ManyToOne({ entity: () => Station, deleteRule: 'cascade' })
  station: Station;

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  author: User;

  @Property({ type: 'string', length: 32 })
  result: ReportResult;

  /** A positive whose times are to come from timing its light curve; typed times are then optional. */
  @Property({ type: 'boolean' })
  timesFromLightCurve: boolean & Opt = false;

  @Property({ type: 'json', nullable: true })
  disappearance: (TimedMark & Opt) | null = null;

  @Property({ type: 'json', nullable: true })
  reappearance: (TimedMark & Opt) | null = null;

  /** For a negative: the UTC span the station watched without seeing the star go out. */
  @Property({ type: 'string', length: 40, nullable: true })
  observedFromUtc: (string & Opt) | null = null;

  @Property({ type: 'string', length: 40, nullable: true })
  observedToUtc: (string & Opt) | null = null;

  @Property({ type: 'json' })
  ringDips: RingDip[] & Opt = [];

  @Property({ type: 'text', nullable: true })
  notes: (string & Opt) | null = null;

  @ManyToOne({ entity: () => Upload, nullable: true, deleteRule: 'set null' })
  lightCurve: (Upload & Opt) | null = null;

  @Property({ type: 'string', length: 16 })
  state: ReportState & Opt = 'submitted';

  /**
   * The author's id while the report is open (submitted or accepted), null once rejected: the unique key
   * (station, openAuthorId) lets MariaDB keep one open report per observer and station.
   */
  @Property({ type: 'string', length: 36, nullable: true })
  openAuthorId: string | null;

  @Property({ type: 'text', nullable: true })
  rejectReason: (string & Opt) | null = null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', onUpdate: () => new Date() })
  updatedAt: Date & Opt = new Date();

  constructor(event: OccultationEvent, station: Station, author: User, result: ReportResult) {
    this.event = event;
    this.station = station;
    this.author = author;
    this.result = result;
    this.openAuthorId = author.id;
  }
}
