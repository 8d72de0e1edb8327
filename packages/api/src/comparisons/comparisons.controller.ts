import { Body, Controller, Get, HttpCode, Param, Post, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import {
  type ComparisonFigureQuery,
  comparisonFigureQuerySchema,
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

  @Get('teams/:teamId/comparison/figure')
  @TeamMember()
  @ApiProduces('image/svg+xml', 'application/pdf', 'image/png')
  @ApiQuery({ name: 'format', enum: ['svg', 'pdf', 'png'] })
  @ApiQuery({ name: 'widthMm', required: false, description: '40 to 300; 88 single column, 180 double' })
  @ApiQuery({ name: 'dpi', required: false, enum: ['300', '600'], description: 'PNG only' })
  @ApiQuery({ name: 'fits', required: false, enum: ['approved', 'all'] })
  @ApiQuery({ name: 'events', required: false, description: 'comma-separated event ids' })
  @ApiQuery({ name: 'jointId', required: false, description: 'a solved joint pole to draw' })
  async figure(
    @Param('teamId') teamId: string,
    @Query(new ZodValidationPipe(comparisonFigureQuerySchema)) query: ComparisonFigureQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const file = await this.comparisons.figure(teamId, query);
    res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
    return new StreamableFile(file.body, { type: file.contentType, length: file.body.length });
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
