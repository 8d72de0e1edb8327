import { randomUUID } from 'node:crypto';
import { Entity, ManyToOne, Opt, PrimaryKey, Property, Unique } from '@mikro-orm/core';
import type { CORRECTION_STATE_VALUES, PatchReportPayload } from '@limbus/schema';
import { User } from '../../users/entities/user.entity';
import { Report } from './report.entity';

export type CorrectionState = (typeof CORRECTION_STATE_VALUES)[number];

/**
 * An observer's request to change their accepted report. The report keeps what was accepted until a
 * coordinator accepts the change. `openReportId` holds the report's id while the request is pending and
 * null after, so the unique key allows one pending request per report, enforced by MariaDB.
 */
@Entity({ tableName: 'report_corrections' })
@Unique({ properties: ['openReportId'] })
export class ReportCorrection {
  @PrimaryKey({ type: 'string', length: 36 })
  id: string = randomUUID();

  @ManyToOne({ entity: () => Report, deleteRule: 'cascade' })
  report: Report;

  @ManyToOne({ entity: () => User, deleteRule: 'cascade' })
  author: User;

  /** The report fields to change, validated as a report edit. */
  @Property({ type: 'json' })
  changes: PatchReportPayload;

  @Property({ type: 'text' })
  message: string;

  @Property({ type: 'string', length: 16 })
  state: CorrectionState & Opt = 'pending';

  @Property({ type: 'string', length: 36, nullable: true })
  openReportId: string | null;

  @ManyToOne({ entity: () => User, nullable: true, deleteRule: 'set null' })
  decidedBy: (User & Opt) | null = null;

  @Property({ type: 'text', nullable: true })
  reason: (string & Opt) | null = null;

  @Property({ type: 'datetime', length: 3 })
  createdAt: Date & Opt = new Date();

  @Property({ type: 'datetime', nullable: true })
  decidedAt: (Date & Opt) | null = null;

  constructor(report: Report, author: User, changes: PatchReportPayload, message: string) {
    this.report = report;
    this.author = author;
    this.changes = changes;
    this.message = message;
    this.openReportId = report.id;
  }
}
