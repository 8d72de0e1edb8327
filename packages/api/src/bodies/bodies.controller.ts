import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import {
  type BodyDetail,
  bodyDetailSchema,
  type BodySummary,
  bodySummarySchema,
  type CreateBodyPayload,
  createBodyPayloadSchema,
  type PatchBodyPayload,
  patchBodyPayloadSchema,
} from '@limbus/schema';
import { z } from 'zod';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import { BodiesService } from './bodies.service';

@ApiTags('bodies')
@ApiBearerAuth()
@Controller()
export class BodiesController {
  constructor(private readonly bodies: BodiesService) {}

  @Get('teams/:teamId/bodies')
  @TeamMember()
  @ApiOkResponse({ schema: openApiSchema(z.array(bodySummarySchema)) })
  list(@Param('teamId') teamId: string): Promise<BodySummary[]> {
    return this.bodies.list(teamId);
  }

  @Post('teams/:teamId/bodies')
  @Roles('coordinator')
  @ApiBody({ schema: openApiSchema(createBodyPayloadSchema) })
  create(
    @CurrentUser() user: AuthUser,
    @Param('teamId') teamId: string,
    @Body(new ZodValidationPipe(createBodyPayloadSchema)) body: CreateBodyPayload,
  ): Promise<BodySummary> {
    return this.bodies.create(user, teamId, body);
  }

  @Get('bodies/:bodyId')
  @TeamMember()
  @ApiOkResponse({ schema: openApiSchema(bodyDetailSchema) })
  one(@Param('bodyId') bodyId: string): Promise<BodyDetail> {
    return this.bodies.detail(bodyId);
  }

  @Patch('bodies/:bodyId')
  @Roles('coordinator')
  @ApiBody({ schema: openApiSchema(patchBodyPayloadSchema) })
  update(
    @CurrentUser() user: AuthUser,
    @Param('bodyId') bodyId: string,
    @Body(new ZodValidationPipe(patchBodyPayloadSchema)) body: PatchBodyPayload,
  ): Promise<BodyDetail> {
    return this.bodies.update(user, bodyId, body);
  }

  @Delete('bodies/:bodyId')
  @Roles('coordinator')
  @HttpCode(204)
  async remove(@CurrentUser() user: AuthUser, @Param('bodyId') bodyId: string): Promise<void> {
    await this.bodies.remove(user, bodyId);
  }
}
