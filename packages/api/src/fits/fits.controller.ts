import {
  Body,
  Controller,
  Get,
  Headers,
  HttpCode,
  Param,
  Post,
  Sse,
  type MessageEvent,
} from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiHeader, ApiQuery, ApiTags } from '@nestjs/swagger';
import { type SubmitFitPayload, submitFitPayloadSchema } from '@limbus/schema';
import type { Observable } from 'rxjs';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { ValidationError } from '../common/domain-errors';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import type { FitSummaryView, FitView } from './fit-view';
import { FitsService } from './fits.service';

@ApiTags('fits')
@ApiBearerAuth()
@Controller()
export class FitsController {
  constructor(private readonly fits: FitsService) {}

  @Post('events/:eventId/fits')
  @Roles('modeller', 'coordinator')
  @HttpCode(202)
  @ApiBody({ schema: openApiSchema(submitFitPayloadSchema) })
  @ApiHeader({
    name: 'Idempotency-Key',
    required: false,
    description: 'a retried submit returns the same fit',
  })
  submit(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Body(new ZodValidationPipe(submitFitPayloadSchema)) body: SubmitFitPayload,
    @Headers('idempotency-key') idempotencyKey: string | undefined,
  ): Promise<{ id: string }> {
    if (idempotencyKey !== undefined && (idempotencyKey.length === 0 || idempotencyKey.length > 200))
      throw new ValidationError([{ path: 'Idempotency-Key', message: 'must be 1 to 200 characters' }]);
    return this.fits.submit(user, eventId, body, idempotencyKey ?? null);
  }

  @Get('events/:eventId/fits')
  @TeamMember()
  list(@Param('eventId') eventId: string): Promise<FitSummaryView[]> {
    return this.fits.list(eventId);
  }

  @Get('fits/:fitId')
  @TeamMember()
  one(@Param('fitId') fitId: string): Promise<FitView> {
    return this.fits.get(fitId);
  }

  /** EventSource cannot send headers, so this route also takes the token as ?access_token=. */
  @Sse('fits/:fitId/events')
  @TeamMember()
  @ApiQuery({ name: 'access_token', required: false, description: 'the access token, for EventSource' })
  async events(@Param('fitId') fitId: string): Promise<Observable<MessageEvent>> {
    await this.fits.find(fitId);
    return this.fits.stream(fitId);
  }
}
