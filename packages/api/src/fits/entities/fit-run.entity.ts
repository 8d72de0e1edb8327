import { randomUUID } from 'node:crypto';
import { Entity, Index, ManyToOne, Opt, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import type { Solution } from '@limbus/geometry';
import { OccultationEvent } from '../../events/entities/occultation-event.entity';
import { User } from '../../users/entities/user.entity';

export const FIT_STATES = ['queued', 'running', 'solved', 'failed'] as const;
export type FitState = (typeof FIT_STATES)[number];
export const REVIEW_STATES = ['none', 'in_review', 'approved', 'returned'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

/** One queued solve: the exact input snapshot, what came out, and who asked. */
@Entity({ tableName: 'fit_runs' })
@Index({ properties: ['event', 'createdAt'] })
@Unique({ properties: ['event', 'createdBy', 'idempotencyKey'] })
export class FitRun {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => OccultationEvent, deleteRule: 'cascade' })
  event: OccultationEvent;

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  createdBy: User;

  /** The event file (limbus-event/1) exactly as hashed; text, so the bytes never change. */
  @Property({ type: 'text', columnType: 'longtext' })
  input: string;

  @Property({ type: 'string', length: 64 })
  inputSha256: string;

  /**
   * SHA-256 of the event's data in the input (star, ephemeris, Earth rotation, stations, chords, ring
   * events; not the title or the fit options), compared with the event's current one to tell a fit run
   * on data that has changed since (eventDataSha256).
   */
  @Property({ type: 'string', length: 64 })
  dataSha256: string;

  /** The request's own options, before they were overlaid on the event's defaults. */
  @Property({ type: 'json' })
  options: Record<string, unknown>;

  @Property({ type: 'string', length: 40 })
  engineVersion: string;

  @Property({ type: 'integer' })
  seed: number;

  @Property({ type: 'string', length: 16 })
  state: FitState & Opt = 'queued';

  /** Percent, 0–100. */
  @Property({ type: 'integer' })
  progress: number & Opt = 0;

  @Property({ type: 'text', nullable: true })
  error: (string & Opt) | null = null;

  @Property({ type: 'json', nullable: true, lazy: true })
  solution: (Solution & Opt) | null = null;

  @Property({ type: 'string', length: 200, nullable: true })
  idempotencyKey: string | null;

  /**
   * SHA-256 of the submit body's canonical JSON, so a retry with the same Idempotency-Key can be told from
   * another request reusing the key; null for fits submitted before it was kept.
   */
  @Property({ type: 'string', length: 64, nullable: true })
  requestSha256: (string & Opt) | null = null;

  @Property({ type: 'integer' })
  attempts: number & Opt = 0;

  @Property({ type: 'string', length: 16 })
  reviewState: ReviewState & Opt = 'none';

  // Milliseconds, so that lists ordered by time keep the order things happened within one second.
  @Property({ type: 'datetime', length: 3 })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', nullable: true })
  startedAt: (Date & Opt) | null = null;

  @Property({ type: 'datetime', nullable: true })
  finishedAt: (Date & Opt) | null = null;

  constructor(
    event: OccultationEvent,
    createdBy: User,
    fields: Pick<
      FitRun,
      'input' | 'inputSha256' | 'dataSha256' | 'options' | 'engineVersion' | 'seed' | 'idempotencyKey'
    >,
  ) {
    this.event = event;
    this.createdBy = createdBy;
    this.input = fields.input;
    this.inputSha256 = fields.inputSha256;
    this.dataSha256 = fields.dataSha256;
    this.options = fields.options;
    this.engineVersion = fields.engineVersion;
    this.seed = fields.seed;
    this.idempotencyKey = fields.idempotencyKey;
  }
}
