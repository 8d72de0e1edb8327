import { randomUUID } from 'node:crypto';
import { Entity, Index, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import type { Chi2Map } from '@limbus/geometry';
import type { Chi2MapRequestPayload } from '@limbus/schema';
import { FitRun } from '../../fits/entities/fit-run.entity';
import { User } from '../../users/entities/user.entity';

export const CHI2_MAP_RUN_STATES = ['queued', 'running', 'solved', 'failed'] as const;
export type Chi2MapRunState = (typeof CHI2_MAP_RUN_STATES)[number];

/** One queued χ² map of a solved fit: the two parameters, ranges and steps asked for, and the map. */
@Entity({ tableName: 'chi2_maps' })
@Index({ properties: ['fit', 'createdAt'] })
export class Chi2MapRun {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => FitRun, deleteRule: 'cascade' })
  fit: FitRun;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  createdBy: User | null;

  @Property({ type: 'json' })
  request: Chi2MapRequestPayload;

  @Property({ type: 'string', length: 16 })
  state: Chi2MapRunState & Opt = 'queued';

  /** Percent of the grid's cells done, 0–100. */
  @Property({ type: 'integer' })
  progress: number & Opt = 0;

  @Property({ type: 'text', nullable: true })
  error: (string & Opt) | null = null;

  @Property({ type: 'json', nullable: true, lazy: true })
  result: (Chi2Map & Opt) | null = null;

  // Milliseconds, so that a fit's maps listed by time keep the order they were asked for.
  @Property({ type: 'datetime', length: 3 })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', nullable: true })
  startedAt: (Date & Opt) | null = null;

  @Property({ type: 'datetime', nullable: true })
  finishedAt: (Date & Opt) | null = null;

  constructor(fit: FitRun, createdBy: User | null, request: Chi2MapRequestPayload) {
    this.fit = fit;
    this.createdBy = createdBy;
    this.request = request;
  }
}
