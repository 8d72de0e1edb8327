import { Body, Controller, Delete, Get, HttpCode, Param, Patch } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { memberViewSchema, type UpdateMemberPayload, updateMemberPayloadSchema } from '@limbus/schema';
import { z } from 'zod';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { TeamSummarySchema } from './dto/team.views';
import { Roles, TeamMember } from './roles.decorator';
import { type MemberView, type TeamSummary, TeamsService } from './teams.service';

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
  @ApiOkResponse({ schema: openApiSchema(z.array(memberViewSchema)) })
  @TeamMember()
  members(@Param('teamId') teamId: string): Promise<MemberView[]> {
    return this.teams.members(teamId);
  }

  @Patch(':teamId/members/:userId')
  @Roles('coordinator')
  @ApiBody({ schema: openApiSchema(updateMemberPayloadSchema) })
  @ApiOkResponse({ schema: openApiSchema(memberViewSchema) })
  updateMember(
    @Param('teamId') teamId: string,
    @Param('userId') userId: string,
    @Body(new ZodValidationPipe(updateMemberPayloadSchema)) body: UpdateMemberPayload,
    @CurrentUser() user: AuthUser,
  ): Promise<MemberView> {
    return this.teams.updateMember(teamId, userId, body.roles, user.id);
  }

  @Delete(':teamId/members/:userId')
  @Roles('coordinator')
  @HttpCode(204)
  removeMember(
    @Param('teamId') teamId: string,
    @Param('userId') userId: string,
    @CurrentUser() user: AuthUser,
  ): Promise<void> {
    return this.teams.removeMember(teamId, userId, user.id);
  }
}
