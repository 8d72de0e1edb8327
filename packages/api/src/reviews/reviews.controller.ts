import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import { type ReviewDecisionPayload, reviewDecisionPayloadSchema } from '@limbus/schema';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import type { ReviewState } from '../fits/entities/fit-run.entity';
import { Roles, TeamMember } from '../teams/roles.decorator';
import { type ReviewView, ReviewsService } from './reviews.service';

@ApiTags('reviews')
@ApiBearerAuth()
@Controller('fits/:fitId')
export class ReviewsController {
  constructor(private readonly reviews: ReviewsService) {}

  /** Only the author may ask; authors are modellers or coordinators, which the guard checks first. */
  @Post('review-request')
  @Roles('modeller', 'coordinator')
  @HttpCode(200)
  request(
    @CurrentUser() user: AuthUser,
    @Param('fitId') fitId: string,
  ): Promise<{ id: string; reviewState: ReviewState }> {
    return this.reviews.requestReview(user, fitId);
  }

  @Post('reviews')
  @Roles('reviewer')
  @ApiBody({ schema: openApiSchema(reviewDecisionPayloadSchema) })
  decide(
    @CurrentUser() user: AuthUser,
    @Param('fitId') fitId: string,
    @Body(new ZodValidationPipe(reviewDecisionPayloadSchema)) body: ReviewDecisionPayload,
  ): Promise<ReviewView> {
    return this.reviews.decide(user, fitId, body);
  }

  @Get('reviews')
  @TeamMember()
  list(@Param('fitId') fitId: string): Promise<ReviewView[]> {
    return this.reviews.list(fitId);
  }
}
