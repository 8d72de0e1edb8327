import { randomUUID } from 'node:crypto';
import { Entity, Index, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import { OccultationEvent } from '../../events/entities/occultation-event.entity';
import { Report } from '../../reports/entities/report.entity';
import { User } from '../../users/entities/user.entity';
import type { TimingOptions } from '../timing-options';
import type { TimingView } from '../timing-result';

export const TIMING_STATES = ['queued', 'running', 'solved', 'failed'] as const;
export type TimingState = (typeof TIMING_STATES)[number];

/** One queued timing fit of a report's uploaded light curve: the options asked for and what came out. */
@Entity({ tableName: 'light_curve_timings' })
@Index({ properties: ['report', 'createdAt'] })
export class LightCurveTiming {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => OccultationEvent, deleteRule: 'cascade' })
  event: OccultationEvent;

  @ManyToOne({ entity: () => Report, deleteRule: 'cascade' })
  report: Report;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  createdBy: User | null;

  /** The upload's SHA-256 when the job was asked for, so a replaced file cannot be timed silently. */
  @Property({ type: 'string', length: 64 })
  uploadSha256: string;

  @Property({ type: 'json' })
  options: TimingOptions;

  @Property({ type: 'string', length: 16 })
  state: TimingState & Opt = 'queued';

  @Property({ type: 'text', nullable: true })
  error: (string & Opt) | null = null;

  @Property({ type: 'json', nullable: true, lazy: true })
  result: (TimingView & Opt) | null = null;

  @Property({ type: 'datetime', nullable: true })
  acceptedAt: (Date & Opt) | null = null;

  @Property({ type: 'datetime', nullable: true })
  ringEventsCreatedAt: (Date & Opt) | null = null;

  @Property({ type: 'datetime' })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', nullable: true })
  finishedAt: (Date & Opt) | null = null;

  constructor(
    event: OccultationEvent,
    report: Report,
    createdBy: User | null,
    fields: { uploadSha256: string; options: TimingOptions },
  ) {
    this.event = event;
    this.report = report;
    this.createdBy = createdBy;
    this.uploadSha256 = fields.uploadSha256;
    this.options = fields.options;
  }
}
