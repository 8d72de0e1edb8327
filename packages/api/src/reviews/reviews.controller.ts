import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  type ReviewDecisionPayload,
  reviewDecisionPayloadSchema,
  type ReviewEntry,
  reviewEntrySchema,
  type ReviewRequestPayload,
  reviewRequestPayloadSchema,
} from '@limbus/schema';
import { z } from 'zod';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import type { ReviewState } from '../fits/entities/fit-run.entity';
import { Roles, TeamMember } from '../teams/roles.decorator';
import { ReviewsService } from './reviews.service';

@ApiTags('reviews')
@ApiBearerAuth()
@Controller()
export class ReviewsController {
  constructor(private readonly reviews: ReviewsService) {}

  /** Only the author may ask; authors are modellers or coordinators, which the guard checks first. */
  @Post('fits/:fitId/review-request')
  @Roles('modeller', 'coordinator')
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(reviewRequestPayloadSchema) })
  request(
    @CurrentUser() user: AuthUser,
    @Param('fitId') fitId: string,
    @Body(new ZodValidationPipe(reviewRequestPayloadSchema)) body: ReviewRequestPayload,
  ): Promise<{ id: string; reviewState: ReviewState }> {
    return this.reviews.requestReview(user, fitId, body);
  }

  @Post('fits/:fitId/reviews')
  @Roles('reviewer')
  @ApiBody({ schema: openApiSchema(reviewDecisionPayloadSchema) })
  decide(
    @CurrentUser() user: AuthUser,
    @Param('fitId') fitId: string,
    @Body(new ZodValidationPipe(reviewDecisionPayloadSchema)) body: ReviewDecisionPayload,
  ): Promise<ReviewEntry> {
    return this.reviews.decide(user, fitId, body);
  }

  @Get('fits/:fitId/reviews')
  @TeamMember()
  @ApiOkResponse({ schema: openApiSchema(z.array(reviewEntrySchema)) })
  list(@Param('fitId') fitId: string): Promise<ReviewEntry[]> {
    return this.reviews.list(fitId);
  }

  @Get('events/:eventId/reviews')
  @TeamMember()
  @ApiOkResponse({ schema: openApiSchema(z.array(reviewEntrySchema)) })
  listForEvent(@Param('eventId') eventId: string): Promise<ReviewEntry[]> {
    return this.reviews.listForEvent(eventId);
  }
}
