import { Controller, Get, Param } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { TeamMember } from './roles.decorator';
import { type TeamMemberView, type TeamSummary, TeamsService } from './teams.service';

@ApiTags('teams')
@ApiBearerAuth()
@Controller('teams')
export class TeamsController {
  constructor(private readonly teams: TeamsService) {}

  @Get()
  mine(@CurrentUser() user: AuthUser): Promise<TeamSummary[]> {
    return this.teams.teamsOf(user.id);
  }

  @Get(':teamId')
  @TeamMember()
  one(@Param('teamId') teamId: string, @CurrentUser() user: AuthUser): Promise<TeamSummary> {
    return this.teams.teamFor(teamId, user.id);
  }

  @Get(':teamId/members')
  @TeamMember()
  members(@Param('teamId') teamId: string): Promise<TeamMemberView[]> {
    return this.teams.members(teamId);
  }
}
