import { Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { type Briefing, briefingSchema, type BriefingsSent, briefingsSentSchema } from '@limbus/schema';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import { BriefingsService } from './briefings.service';

@ApiTags('planning')
@ApiBearerAuth()
@Controller('events/:eventId')
export class BriefingsController {
  constructor(private readonly briefings: BriefingsService) {}

  /** E-mails every observer with a planned or observing station their briefing. */
  @Post('briefings')
  @Roles('coordinator')
  @HttpCode(200)
  @ApiOkResponse({ schema: openApiSchema(briefingsSentSchema) })
  send(@CurrentUser() user: AuthUser, @Param('eventId') eventId: string): Promise<BriefingsSent> {
    return this.briefings.send(user, eventId);
  }

  /** The signed-in member's own stations (every station for coordinators), as the e-mail says them. */
  @Get('briefing')
  @TeamMember()
  @ApiOkResponse({ schema: openApiSchema(briefingSchema) })
  briefing(@CurrentUser() user: AuthUser, @Param('eventId') eventId: string): Promise<Briefing> {
    return this.briefings.forUser(user, eventId);
  }
}
