import { Body, Controller, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import {
  type CreateReportPayload,
  createReportPayloadSchema,
  type PatchReportPayload,
  patchReportPayloadSchema,
  rejectReportPayloadSchema,
} from '@limbus/schema';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import type { ReportView } from './report-view';
import { ReportsService } from './reports.service';

@ApiTags('reports')
@ApiBearerAuth()
@Controller()
export class ReportsController {
  constructor(private readonly reports: ReportsService) {}

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

  @Post('reports/:reportId/accept')
  @Roles('coordinator')
  @HttpCode(200)
  accept(@CurrentUser() user: AuthUser, @Param('reportId') reportId: string): Promise<ReportView> {
    return this.reports.accept(user, reportId);
  }

  @Post('reports/:reportId/reject')
  @Roles('coordinator')
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(rejectReportPayloadSchema) })
  reject(
    @CurrentUser() user: AuthUser,
    @Param('reportId') reportId: string,
    @Body(new ZodValidationPipe(rejectReportPayloadSchema)) body: { reason: string },
  ): Promise<ReportView> {
    return this.reports.reject(user, reportId, body.reason);
  }
}
