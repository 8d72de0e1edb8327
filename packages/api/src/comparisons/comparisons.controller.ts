import {
  applyDecorators,
  Body,
  Controller,
  Get,
  HttpCode,
  Param,
  Post,
  Query,
  Res,
  StreamableFile,
} from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import type { ExportFile } from '../exports/exports.service';
import { sendExportFile } from '../exports/send-export-file';
import {
  COMPARISON_SELECTIONS,
  type ComparisonFigureQuery,
  comparisonFigureQuerySchema,
  type ComparisonQuery,
  comparisonQuerySchema,
  type JointPolePayload,
  jointPolePayloadSchema,
} from './comparison-schemas';
import type { ComparisonView } from './comparison-view';
import { ComparisonsService, type JointPoleView } from './comparisons.service';

/** The query parameters of a comparison figure, for the OpenAPI document. */
function FigureQueryDocs(): MethodDecorator {
  return applyDecorators(
    ApiProduces('image/svg+xml', 'application/pdf', 'image/png'),
    ApiQuery({ name: 'format', enum: ['svg', 'pdf', 'png'] }),
    ApiQuery({ name: 'widthMm', required: false, description: '40 to 300; 88 single column, 180 double' }),
    ApiQuery({ name: 'dpi', required: false, enum: ['300', '600'], description: 'PNG only' }),
    ApiQuery({ name: 'fits', required: false, enum: COMPARISON_SELECTIONS }),
    ApiQuery({ name: 'events', required: false, description: 'comma-separated event ids' }),
    ApiQuery({ name: 'jointId', required: false, description: 'a solved joint pole to draw' }),
  );
}

function sendFile(res: Response, file: ExportFile): StreamableFile {
  return sendExportFile(res, file);
}

@ApiTags('comparisons')
@ApiBearerAuth()
@Controller()
export class ComparisonsController {
  constructor(private readonly comparisons: ComparisonsService) {}

  /** Every team route refuses fits of several bodies; the body routes are what the client uses. */
  @Get('teams/:teamId/comparison')
  @TeamMember()
  @ApiQuery({ name: 'fits', required: false, enum: COMPARISON_SELECTIONS })
  @ApiQuery({ name: 'bodyId', required: false, description: 'one body of the team' })
  @ApiQuery({ name: 'events', required: false, description: 'comma-separated event ids' })
  comparison(
    @Param('teamId') teamId: string,
    @Query(new ZodValidationPipe(comparisonQuerySchema)) query: ComparisonQuery,
  ): Promise<ComparisonView> {
    return this.comparisons.comparison({ teamId }, query);
  }

  @Get('bodies/:bodyId/comparison')
  @TeamMember()
  @ApiQuery({ name: 'fits', required: false, enum: COMPARISON_SELECTIONS })
  @ApiQuery({ name: 'events', required: false, description: 'comma-separated event ids' })
  async bodyComparison(
    @Param('bodyId') bodyId: string,
    @Query(new ZodValidationPipe(comparisonQuerySchema)) query: ComparisonQuery,
  ): Promise<ComparisonView> {
    return this.comparisons.comparison(await this.comparisons.scopeOfBody(bodyId), query);
  }

  @Get('teams/:teamId/comparison/figure')
  @TeamMember()
  @FigureQueryDocs()
  async figure(
    @Param('teamId') teamId: string,
    @Query(new ZodValidationPipe(comparisonFigureQuerySchema)) query: ComparisonFigureQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return sendFile(res, await this.comparisons.figure({ teamId }, query));
  }

  @Get('bodies/:bodyId/comparison/figure')
  @TeamMember()
  @FigureQueryDocs()
  async bodyFigure(
    @Param('bodyId') bodyId: string,
    @Query(new ZodValidationPipe(comparisonFigureQuerySchema)) query: ComparisonFigureQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return sendFile(res, await this.comparisons.figure(await this.comparisons.scopeOfBody(bodyId), query));
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
    return this.comparisons.submitJoint(user, { teamId }, body);
  }

  @Post('bodies/:bodyId/joint-poles')
  @Roles('modeller', 'coordinator')
  @HttpCode(202)
  @ApiBody({ schema: openApiSchema(jointPolePayloadSchema) })
  async submitBodyJoint(
    @CurrentUser() user: AuthUser,
    @Param('bodyId') bodyId: string,
    @Body(new ZodValidationPipe(jointPolePayloadSchema)) body: JointPolePayload,
  ): Promise<{ id: string }> {
    return this.comparisons.submitJoint(user, await this.comparisons.scopeOfBody(bodyId), body);
  }

  @Get('joint-poles/:jointId')
  @TeamMember()
  joint(@Param('jointId') jointId: string): Promise<JointPoleView> {
    return this.comparisons.getJoint(jointId);
  }
}
