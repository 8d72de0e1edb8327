import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
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
  defaults(@Param('eventId') eventId: string, @Param('reportId') reportId: string): Promise<TimingDefaults> {
    return this.timings.defaults(eventId, reportId);
  }

  @Get('reports/:reportId/timings')
  @TeamMember()
  list(@Param('eventId') eventId: string, @Param('reportId') reportId: string): Promise<TimingSummary[]> {
    return this.timings.list(eventId, reportId);
  }

  @Get('timings/:timingId')
  @TeamMember()
  one(@Param('eventId') eventId: string, @Param('timingId') timingId: string): Promise<TimingDetail> {
    return this.timings.detail(eventId, timingId);
  }

  @Post('timings/:timingId/accept')
  @Roles('coordinator', 'modeller')
  @HttpCode(200)
  accept(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('timingId') timingId: string,
  ): Promise<{ chordId: string }> {
    return this.timings.accept(user, eventId, timingId);
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
