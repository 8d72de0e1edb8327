import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import { type AcceptIntoChordPayload, acceptIntoChordPayloadSchema } from '@limbus/schema';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import {
  type DipsToRingEventsPayload,
  dipsToRingEventsSchema,
  type MarkDipPayload,
  markDipSchema,
  type TimingOptions,
  timingOptionsSchema,
} from './timing-options';
import type { ReportView } from '../reports/report-view';
import type { TimingDefaults } from './timing-defaults';
import { type TimingDetail, type TimingSummary, TimingsService } from './timings.service';

@ApiTags('timings')
@ApiBearerAuth()
@Controller('events/:eventId')
export class TimingsController {
  constructor(private readonly timings: TimingsService) {}

  @Post('reports/:reportId/timings')
  @Roles('coordinator', 'modeller')
  @HttpCode(202)
  @ApiBody({ schema: openApiSchema(timingOptionsSchema) })
  create(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('reportId') reportId: string,
    @Body(new ZodValidationPipe(timingOptionsSchema)) body: TimingOptions,
  ): Promise<TimingSummary> {
    return this.timings.create(user, eventId, reportId, body);
  }

  @Get('reports/:reportId/timing-defaults')
  @TeamMember()
  defaults(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('reportId') reportId: string,
  ): Promise<TimingDefaults> {
    return this.timings.defaults(user, eventId, reportId);
  }

  @Get('reports/:reportId/timings')
  @TeamMember()
  list(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('reportId') reportId: string,
  ): Promise<TimingSummary[]> {
    return this.timings.list(user, eventId, reportId);
  }

  @Get('timings/:timingId')
  @TeamMember()
  one(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('timingId') timingId: string,
  ): Promise<TimingDetail> {
    return this.timings.detail(user, eventId, timingId);
  }

  /** 409 `replaces-better-timing` when the chord holds better-timed values, unless `replaceTimedChord`. */
  @Post('timings/:timingId/accept')
  @Roles('coordinator', 'modeller')
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(acceptIntoChordPayloadSchema), required: false })
  accept(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('timingId') timingId: string,
    @Body(new ZodValidationPipe(acceptIntoChordPayloadSchema)) body: AcceptIntoChordPayload,
  ): Promise<{ chordId: string; report: ReportView }> {
    return this.timings.accept(user, eventId, timingId, body.replaceTimedChord);
  }

  @Post('timings/:timingId/ring-events')
  @Roles('coordinator', 'modeller')
  @ApiBody({ schema: openApiSchema(dipsToRingEventsSchema) })
  ringEvents(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('timingId') timingId: string,
    @Body(new ZodValidationPipe(dipsToRingEventsSchema)) body: DipsToRingEventsPayload,
  ): Promise<{ ringEventIds: string[] }> {
    return this.timings.dipsToRingEvents(user, eventId, timingId, body);
  }

  @Post('timings/:timingId/dips')
  @Roles('coordinator', 'modeller')
  @HttpCode(202)
  @ApiBody({ schema: openApiSchema(markDipSchema) })
  markDip(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('timingId') timingId: string,
    @Body(new ZodValidationPipe(markDipSchema)) body: MarkDipPayload,
  ): Promise<TimingSummary> {
    return this.timings.markDip(user, eventId, timingId, body);
  }
}
