import { randomUUID } from 'node:crypto';
import { Check, Entity, ManyToOne, Opt, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import type { StationStatus } from '@limbus/schema';
import { OccultationEvent } from '../../events/entities/occultation-event.entity';
import { User } from '../../users/entities/user.entity';

/** An observing site of one event; `code` is the station id the event file and chords use. */
@Entity({ tableName: 'stations' })
@Unique({ properties: ['event', 'code'] })
export class Station {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => OccultationEvent, deleteRule: 'cascade' })
  event: OccultationEvent;

  @Property({ type: 'string', length: 100 })
  code: string;

  @Property({ type: 'double' })
  latDeg: number;

  @Property({ type: 'double' })
  lonDeg: number;

  @Property({ type: 'double' })
  heightM: number;

  /** The invited observer who may report for this station. */
  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  observer: (User & Opt) | null = null;

  @Property({ type: 'string', length: 200, nullable: true })
  observerName: (string & Opt) | null = null;

  @Property({ type: 'double', nullable: true })
  apertureMm: (number & Opt) | null = null;

  @Property({ type: 'string', length: 200, nullable: true })
  camera: (string & Opt) | null = null;

  @Property({ type: 'double', nullable: true })
  exposureSeconds: (number & Opt) | null = null;

  @Property({ type: 'string', length: 200, nullable: true })
  timeSource: (string & Opt) | null = null;

  /**
   * `observing` (the default: a station of the night), `planned` (placed ahead by a coordinator) or
   * `proposed` (an observer's own site awaiting the coordinator). Only observing stations, and any other
   * that a chord or ring event names, enter fits (eventFileOf); a prediction lists every station.
   */
  @Property({ type: 'string', length: 16, default: 'observing' })
  @Check({ name: 'stations_status_check', expression: "`status` in ('observing', 'planned', 'proposed')" })
  status: StationStatus & Opt = 'observing';

  /** What an observer wrote with a proposed site (access, horizon, permission). */
  @Property({ type: 'text', nullable: true })
  notes: (string & Opt) | null = null;

  /** Keeps the event file's station order through a round trip. */
  @Property({ type: 'integer' })
  position: number & Opt = 0;

  constructor(
    event: OccultationEvent,
    fields: { code: string; latDeg: number; lonDeg: number; heightM: number },
  ) {
    this.event = event;
    this.code = fields.code;
    this.latDeg = fields.latDeg;
    this.lonDeg = fields.lonDeg;
    this.heightM = fields.heightM;
  }
}
