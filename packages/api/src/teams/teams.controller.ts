import { Controller, Get, Param } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { openApiSchema } from '../common/zod-validation.pipe';
import { TeamMemberSchema, TeamSummarySchema } from './dto/team.views';
import { z } from 'zod';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { TeamMember } from './roles.decorator';
import { type TeamMemberView, type TeamSummary, TeamsService } from './teams.service';

@ApiTags('teams')
@ApiBearerAuth()
@Controller('teams')
export class TeamsController {
  constructor(private readonly teams: TeamsService) {}

  @Get()
  @ApiOkResponse({ schema: openApiSchema(z.array(TeamSummarySchema)) })
  mine(@CurrentUser() user: AuthUser): Promise<TeamSummary[]> {
    return this.teams.teamsOf(user.id);
  }

  @Get(':teamId')
  @ApiOkResponse({ schema: openApiSchema(TeamSummarySchema) })
  @TeamMember()
  one(@Param('teamId') teamId: string, @CurrentUser() user: AuthUser): Promise<TeamSummary> {
    return this.teams.teamFor(teamId, user.id);
  }

  @Get(':teamId/members')
  @ApiOkResponse({ schema: openApiSchema(z.array(TeamMemberSchema)) })
  @TeamMember()
  members(@Param('teamId') teamId: string): Promise<TeamMemberView[]> {
    return this.teams.members(teamId);
  }
}
