import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import type { DipOpacity, TimedMark } from '@limbus/geometry';
import { OccultationEvent } from '../../events/entities/occultation-event.entity';
import { Report } from '../../reports/entities/report.entity';
import { Station } from '../../stations/entities/station.entity';

/** One dip of the star behind a ring, as one station timed it. */
@Entity({ tableName: 'ring_events' })
export class RingEvent {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => OccultationEvent, deleteRule: 'cascade' })
  event: OccultationEvent;

  @ManyToOne({ entity: () => Station, deleteRule: 'cascade' })
  station: Station;

  @Property({ type: 'string', length: 100 })
  ring: string;

  @Property({ type: 'json' })
  start: TimedMark;

  @Property({ type: 'json' })
  end: TimedMark;

  /** The dip's apparent opacity from its light curve; null when it was timed without its depth. */
  @Property({ type: 'json', nullable: true })
  apparentOpacity: (DipOpacity & Opt) | null = null;

  @ManyToOne({ entity: () => Report, nullable: true, deleteRule: 'set null' })
  report: (Report & Opt) | null = null;

  @Property({ type: 'integer' })
  position: number & Opt = 0;

  constructor(
    event: OccultationEvent,
    station: Station,
    fields: { ring: string; start: TimedMark; end: TimedMark; apparentOpacity?: DipOpacity | undefined },
  ) {
    this.event = event;
    this.station = station;
    this.ring = fields.ring;
    this.start = fields.start;
    this.end = fields.end;
    this.apparentOpacity = fields.apparentOpacity ? { ...fields.apparentOpacity } : null;
  }
}
