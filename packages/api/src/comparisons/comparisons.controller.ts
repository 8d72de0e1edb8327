import { Body, Controller, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiQuery, ApiTags } from '@nestjs/swagger';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import {
  type ComparisonQuery,
  comparisonQuerySchema,
  type JointPolePayload,
  jointPolePayloadSchema,
} from './comparison-schemas';
import type { ComparisonView } from './comparison-view';
import { ComparisonsService, type JointPoleView } from './comparisons.service';

@ApiTags('comparisons')
@ApiBearerAuth()
@Controller()
export class ComparisonsController {
  constructor(private readonly comparisons: ComparisonsService) {}

  @Get('teams/:teamId/comparison')
  @TeamMember()
  @ApiQuery({ name: 'fits', required: false, enum: ['approved', 'all'] })
  @ApiQuery({ name: 'events', required: false, description: 'comma-separated event ids' })
  comparison(
    @Param('teamId') teamId: string,
    @Query(new ZodValidationPipe(comparisonQuerySchema)) query: ComparisonQuery,
  ): Promise<ComparisonView> {
    return this.comparisons.comparison(teamId, query);
  }

  @Post('teams/:teamId/joint-poles')
  @Roles('modeller', 'coordinator')
  @HttpCode(202)
  @ApiBody({ schema: openApiSchema(jointPolePayloadSchema) })
  submitJoint(
    @CurrentUser() user: AuthUser,
    @Param('teamId') teamId: string,
    @Body(new ZodValidationPipe(jointPolePayloadSchema)) body: JointPolePayload,
  ): Promise<{ id: string }> {
    return this.comparisons.submitJoint(user, teamId, body);
  }

  @Get('joint-poles/:jointId')
  @TeamMember()
  joint(@Param('jointId') jointId: string): Promise<JointPoleView> {
    return this.comparisons.getJoint(jointId);
  }
}
