import { Body, Controller, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import {
  type AcceptSiteProposalPayload,
  acceptSiteProposalPayloadSchema,
  type DeclineSiteProposalPayload,
  declineSiteProposalPayloadSchema,
  type SiteProposalPayload,
  siteProposalPayloadSchema,
} from '@limbus/schema';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import type { StationView } from '../events/views';
import { Roles } from '../teams/roles.decorator';
import { SiteProposalsService } from './site-proposals.service';

@ApiTags('planning')
@ApiBearerAuth()
@Controller('events/:eventId/site-proposals')
export class SiteProposalsController {
  constructor(private readonly proposals: SiteProposalsService) {}

  /** An observer's own site: a `proposed` station with them as its observer, awaiting a coordinator. */
  @Post()
  @Roles('observer')
  @ApiBody({ schema: openApiSchema(siteProposalPayloadSchema) })
  propose(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Body(new ZodValidationPipe(siteProposalPayloadSchema)) body: SiteProposalPayload,
  ): Promise<StationView> {
    return this.proposals.propose(user, eventId, body);
  }

  @Post(':stationId/accept')
  @Roles('coordinator')
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(acceptSiteProposalPayloadSchema) })
  accept(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('stationId') stationId: string,
    @Body(new ZodValidationPipe(acceptSiteProposalPayloadSchema)) body: AcceptSiteProposalPayload,
  ): Promise<StationView> {
    return this.proposals.accept(user, eventId, stationId, body);
  }

  @Post(':stationId/decline')
  @Roles('coordinator')
  @HttpCode(204)
  @ApiBody({ schema: openApiSchema(declineSiteProposalPayloadSchema) })
  async decline(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('stationId') stationId: string,
    @Body(new ZodValidationPipe(declineSiteProposalPayloadSchema)) body: DeclineSiteProposalPayload,
  ): Promise<void> {
    await this.proposals.decline(user, eventId, stationId, body);
  }
}
