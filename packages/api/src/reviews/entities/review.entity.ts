import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property } from '@mikro-orm/core';
import { FitRun } from '../../fits/entities/fit-run.entity';
import { User } from '../../users/entities/user.entity';

import { REVIEW_ENTRY_KINDS } from '@limbus/schema';

/** A review request (with the modeller's message) is kept in the same history as the decisions. */
export const REVIEW_DECISIONS = REVIEW_ENTRY_KINDS;
export type ReviewDecision = (typeof REVIEW_DECISIONS)[number];

@Entity({ tableName: 'reviews' })
export class Review {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => FitRun, deleteRule: 'cascade' })
  fit: FitRun;

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  reviewer: User;

  @Property({ type: 'string', length: 16 })
  decision: ReviewDecision;

  @Property({ type: 'text' })
  comment: string;

  // Milliseconds, so that lists ordered by time keep the order things happened within one second.
  @Property({ type: 'datetime', length: 3 })
  createdAt: Date & Opt = new Date();

  constructor(fit: FitRun, reviewer: User, decision: ReviewDecision, comment: string) {
    this.fit = fit;
    this.reviewer = reviewer;
    this.decision = decision;
    this.comment = comment;
  }
}
