import { Body, Controller, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import {
  type AcceptIntoChordPayload,
  acceptIntoChordPayloadSchema,
  type CorrectionView,
  type CreateReportPayload,
  createReportPayloadSchema,
  type PatchReportPayload,
  patchReportPayloadSchema,
  type RejectReportPayload,
  rejectReportPayloadSchema,
  type ReportCorrectionPayload,
  reportCorrectionPayloadSchema,
} from '@limbus/schema';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import { CorrectionsService } from './corrections.service';
import type { ReportView } from './report-view';
import { ReportsService } from './reports.service';

@ApiTags('reports')
@ApiBearerAuth()
@Controller()
export class ReportsController {
  constructor(
    private readonly reports: ReportsService,
    private readonly corrections: CorrectionsService,
  ) {}

  @Get('events/:eventId/reports')
  @TeamMember()
  list(@CurrentUser() user: AuthUser, @Param('eventId') eventId: string): Promise<ReportView[]> {
    return this.reports.list(user, eventId);
  }

  /** Any observer of the team passes the guard; the service lets only the station's own observer in. */
  @Post('events/:eventId/reports')
  @Roles('observer')
  @ApiBody({ schema: openApiSchema(createReportPayloadSchema) })
  create(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Body(new ZodValidationPipe(createReportPayloadSchema)) body: CreateReportPayload,
  ): Promise<ReportView> {
    return this.reports.create(user, eventId, body);
  }

  @Patch('reports/:reportId')
  @TeamMember()
  @ApiBody({ schema: openApiSchema(patchReportPayloadSchema) })
  update(
    @CurrentUser() user: AuthUser,
    @Param('reportId') reportId: string,
    @Body(new ZodValidationPipe(patchReportPayloadSchema)) body: PatchReportPayload,
  ): Promise<ReportView> {
    return this.reports.update(user, reportId, body);
  }

  /** 409 `replaces-better-timing` when the chord holds better-timed values, unless `replaceTimedChord`. */
  @Post('reports/:reportId/accept')
  @Roles('coordinator')
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(acceptIntoChordPayloadSchema), required: false })
  accept(
    @CurrentUser() user: AuthUser,
    @Param('reportId') reportId: string,
    @Body(new ZodValidationPipe(acceptIntoChordPayloadSchema)) body: AcceptIntoChordPayload,
  ): Promise<ReportView> {
    return this.reports.accept(user, reportId, body.replaceTimedChord);
  }

  @Post('reports/:reportId/reject')
  @Roles('coordinator')
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(rejectReportPayloadSchema) })
  reject(
    @CurrentUser() user: AuthUser,
    @Param('reportId') reportId: string,
    @Body(new ZodValidationPipe(rejectReportPayloadSchema)) body: RejectReportPayload,
  ): Promise<ReportView> {
    return this.reports.reject(user, reportId, body.reason);
  }

  /** Any member passes the guard; the service lets only the report's author in. */
  @Post('reports/:reportId/corrections')
  @TeamMember()
  @ApiBody({ schema: openApiSchema(reportCorrectionPayloadSchema) })
  requestCorrection(
    @CurrentUser() user: AuthUser,
    @Param('reportId') reportId: string,
    @Body(new ZodValidationPipe(reportCorrectionPayloadSchema)) body: ReportCorrectionPayload,
  ): Promise<CorrectionView> {
    return this.corrections.request(user, reportId, body);
  }

  @Post('reports/:reportId/corrections/:correctionId/accept')
  @Roles('coordinator')
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(acceptIntoChordPayloadSchema), required: false })
  acceptCorrection(
    @CurrentUser() user: AuthUser,
    @Param('reportId') reportId: string,
    @Param('correctionId') correctionId: string,
    @Body(new ZodValidationPipe(acceptIntoChordPayloadSchema)) body: AcceptIntoChordPayload,
  ): Promise<ReportView> {
    return this.corrections.accept(user, reportId, correctionId, body.replaceTimedChord);
  }

  @Post('reports/:reportId/corrections/:correctionId/reject')
  @Roles('coordinator')
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(rejectReportPayloadSchema) })
  rejectCorrection(
    @CurrentUser() user: AuthUser,
    @Param('reportId') reportId: string,
    @Param('correctionId') correctionId: string,
    @Body(new ZodValidationPipe(rejectReportPayloadSchema)) body: RejectReportPayload,
  ): Promise<ReportView> {
    return this.corrections.reject(user, reportId, correctionId, body.reason);
  }
}
