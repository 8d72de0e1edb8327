import { Body, Controller, HttpCode, Param, Post, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { TABLE_FORMATS, TABLE_TYPES, type TableQuery, tableQuerySchema } from '../exports/export-query';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { TeamMember } from '../teams/roles.decorator';
import { type ShapePayload, shapePayloadSchema } from './shape-schemas';
import type { FitScope } from '../bodies/body-scope';
import { ShapesService, type ShapeView } from './shapes.service';
import { setAttachment } from '../common/content-disposition';

@ApiTags('shapes')
@ApiBearerAuth()
@Controller()
export class ShapesController {
  constructor(private readonly shapes: ShapesService) {}

  // Synchronous: the fit takes milliseconds and stores nothing, so any member of the team may run it.
  @Post('teams/:teamId/shape')
  @TeamMember()
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(shapePayloadSchema) })
  fit(
    @Param('teamId') teamId: string,
    @Body(new ZodValidationPipe(shapePayloadSchema)) body: ShapePayload,
  ): Promise<ShapeView> {
    return this.shapes.fit({ teamId }, body);
  }

  @Post('bodies/:bodyId/shape')
  @TeamMember()
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(shapePayloadSchema) })
  async bodyFit(
    @Param('bodyId') bodyId: string,
    @Body(new ZodValidationPipe(shapePayloadSchema)) body: ShapePayload,
  ): Promise<ShapeView> {
    return this.shapes.fit(await this.shapes.scopeOfBody(bodyId), body);
  }

  @Post('teams/:teamId/shape/table')
  @TeamMember()
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(shapePayloadSchema) })
  @ApiProduces('text/csv', 'application/json', 'application/x-tex')
  @ApiQuery({ name: 'format', enum: TABLE_FORMATS })
  table(
    @Param('teamId') teamId: string,
    @Query(new ZodValidationPipe(tableQuerySchema)) query: TableQuery,
    @Body(new ZodValidationPipe(shapePayloadSchema)) body: ShapePayload,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return this.sendTable(res, { teamId }, body, query);
  }

  @Post('bodies/:bodyId/shape/table')
  @TeamMember()
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(shapePayloadSchema) })
  @ApiProduces('text/csv', 'application/json', 'application/x-tex')
  @ApiQuery({ name: 'format', enum: TABLE_FORMATS })
  async bodyTable(
    @Param('bodyId') bodyId: string,
    @Query(new ZodValidationPipe(tableQuerySchema)) query: TableQuery,
    @Body(new ZodValidationPipe(shapePayloadSchema)) body: ShapePayload,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return this.sendTable(res, await this.shapes.scopeOfBody(bodyId), body, query);
  }

  private async sendTable(
    res: Response,
    scope: FitScope,
    body: ShapePayload,
    query: TableQuery,
  ): Promise<StreamableFile> {
    const text = Buffer.from(await this.shapes.table(scope, body, query.format), 'utf8');
    setAttachment(res, `limbus-shape.${query.format}`);
    return new StreamableFile(text, { type: TABLE_TYPES[query.format], length: text.length });
  }
}
