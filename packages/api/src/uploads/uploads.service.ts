import { createHash } from 'node:crypto';
import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { safeFileName } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from '../common/domain-errors';
import { rolesIn } from '../events/team-choice';
import type { ReportView } from '../reports/report-view';
import { ReportsService } from '../reports/reports.service';
import { StorageService } from '../storage/storage.service';
import { User } from '../users/entities/user.entity';
import { Upload } from './entities/upload.entity';
import { checkLightCurveCsv } from './light-curve-csv';
import type { UploadedPart } from './uploaded-part';

/** The name of a light curve sent without a usable one. */
export const LIGHT_CURVE_FILE_NAME = 'light-curve.csv';

@Injectable()
export class UploadsService {
  constructor(
    private readonly em: EntityManager,
    private readonly reports: ReportsService,
    private readonly storage: StorageService,
    private readonly audit: AuditService,
  ) {}

  /**
   * Author (until accepted) or coordinator; another observer's report is as missing. Bytes go to the
   * store first, the row only if that worked.
   */
  async attachLightCurve(
    user: AuthUser,
    reportId: string,
    file: UploadedPart | undefined,
  ): Promise<ReportView> {
    if (!file)
      throw new ValidationError([{ path: 'file', message: 'missing; send the CSV as field "file"' }]);
    const report = await this.reports.findVisible(user, reportId);
    const isCoordinator = (await rolesIn(this.em, user, report.event.team.id)).includes('coordinator');
    if (report.author.id !== user.id && !isCoordinator)
      throw new ForbiddenError('Only the author or a coordinator can attach a light curve');
    if (report.state === 'accepted' && !isCoordinator)
      throw new ConflictError('The report is already accepted');
    const text = file.buffer.toString('utf8');
    const check = checkLightCurveCsv(text);
    if (!check.ok) throw new ValidationError(check.problems);
    const upload = new Upload({
      team: report.event.team,
      storageKey: '',
      name: safeFileName(file.originalname, LIGHT_CURVE_FILE_NAME),
      contentType: 'text/csv',
      sizeBytes: file.size,
      sha256: createHash('sha256').update(file.buffer).digest('hex'),
      createdBy: this.em.getReference(User, user.id),
    });
    upload.storageKey = `teams/${report.event.team.id}/light-curves/${upload.id}.csv`;
    await this.storage.put(upload.storageKey, file.buffer, 'text/csv');
    const previous = report.lightCurve;
    report.lightCurve = upload;
    this.em.persist(upload);
    this.audit.record(this.em, {
      teamId: report.event.team.id,
      eventId: report.event.id,
      actorId: user.id,
      action: 'report.light-curve',
      objectType: 'report',
      objectId: report.id,
      detail: {
        uploadId: upload.id,
        sha256: upload.sha256,
        rows: check.rows,
        replaced: previous?.id ?? null,
      },
    });
    await this.em.flush();
    return this.reports.view(report);
  }

  /** Every member but an observer who is not the report's author. */
  async lightCurve(user: AuthUser, reportId: string): Promise<{ upload: Upload; bytes: Buffer }> {
    const report = await this.reports.findVisible(user, reportId);
    if (!report.lightCurve) throw new NotFoundError('This report has no light curve');
    return { upload: report.lightCurve, bytes: await this.storage.get(report.lightCurve.storageKey) };
  }
}
