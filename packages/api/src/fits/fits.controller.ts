import {
  Body,
  Controller,
  Get,
  Headers,
  HttpCode,
  Param,
  Post,
  Query,
  Sse,
  type MessageEvent,
} from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiCreatedResponse, ApiHeader, ApiQuery, ApiTags } from '@nestjs/swagger';
import {
  type StreamTicket,
  streamTicketSchema,
  type SubmitFitPayload,
  submitFitPayloadSchema,
} from '@limbus/schema';
import type { Observable } from 'rxjs';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { Public } from '../auth/public.decorator';
import { ValidationError } from '../common/domain-errors';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import type { FitSummaryView, FitView } from './fit-view';
import { FitsService } from './fits.service';
import { StreamTickets } from './stream-tickets';

@ApiTags('fits')
@ApiBearerAuth()
@Controller()
export class FitsController {
  constructor(
    private readonly fits: FitsService,
    private readonly tickets: StreamTickets,
  ) {}

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

  /** A one-time ticket for the progress stream, which a browser's EventSource opens without headers. */
  @Post('fits/:fitId/stream-ticket')
  @TeamMember()
  @ApiCreatedResponse({ schema: openApiSchema(streamTicketSchema) })
  async streamTicket(@Param('fitId') fitId: string, @CurrentUser() user: AuthUser): Promise<StreamTicket> {
    await this.fits.find(fitId);
    return this.tickets.issue(user.id, fitId);
  }

  /** Public: the ticket, issued to a member of the fit's team for this fit, is the credential. */
  @Sse('fits/:fitId/events')
  @Public()
  @ApiQuery({ name: 'ticket', required: true, description: 'from POST /api/fits/:fitId/stream-ticket' })
  async events(
    @Param('fitId') fitId: string,
    @Query('ticket') ticket: string | undefined,
  ): Promise<Observable<MessageEvent>> {
    await this.tickets.redeem(ticket, fitId);
    await this.fits.find(fitId);
    return this.fits.stream(fitId);
  }
}
