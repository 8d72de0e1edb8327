import {
  Body,
  Controller,
  Get,
  HttpCode,
  Param,
  Post,
  Query,
  Res,
  type StreamableFile,
} from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import {
  type Chi2MapList,
  type Chi2MapRequestPayload,
  type Chi2MapView,
  chi2MapRequestSchema,
  validateChi2MapRequest,
} from '@limbus/schema';
import type { Response } from 'express';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { ValidationError } from '../common/domain-errors';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import {
  FIGURE_FORMATS,
  type FigureQuery,
  figureQuerySchema,
  type TableQuery,
  tableQuerySchema,
} from '../exports/export-query';
import { sendExportFile } from '../exports/send-export-file';
import { Roles, TeamMember } from '../teams/roles.decorator';
import { Chi2MapsService } from './chi2-maps.service';

/** The request checked with the contract's own schema, so that an unknown key is refused by its name. */
function mapRequest(body: unknown): Chi2MapRequestPayload {
  const result = validateChi2MapRequest(body);
  if (!result.ok) throw new ValidationError(result.problems);
  return result.request;
}

/** χ² maps of a fit; team scope comes from :fitId, and a map of another fit answers 404. */
@ApiTags('chi2-maps')
@ApiBearerAuth()
@Controller('fits/:fitId/chi2-maps')
export class Chi2MapsController {
  constructor(private readonly maps: Chi2MapsService) {}

  @Post()
  @Roles('modeller', 'coordinator')
  @HttpCode(202)
  @ApiBody({ schema: openApiSchema(chi2MapRequestSchema) })
  submit(
    @CurrentUser() user: AuthUser,
    @Param('fitId') fitId: string,
    @Body() body: unknown,
  ): Promise<{ id: string }> {
    return this.maps.submit(user, fitId, mapRequest(body));
  }

  @Get()
  @TeamMember()
  list(@Param('fitId') fitId: string): Promise<Chi2MapList> {
    return this.maps.list(fitId);
  }

  @Get(':mapId')
  @TeamMember()
  one(@Param('fitId') fitId: string, @Param('mapId') mapId: string): Promise<Chi2MapView> {
    return this.maps.get(fitId, mapId);
  }

  @Get(':mapId/table')
  @TeamMember()
  @ApiProduces('text/csv', 'application/json')
  @ApiQuery({ name: 'format', enum: ['csv', 'json'] })
  async table(
    @Param('fitId') fitId: string,
    @Param('mapId') mapId: string,
    @Query(new ZodValidationPipe(tableQuerySchema)) query: TableQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return sendExportFile(res, await this.maps.table(fitId, mapId, query));
  }

  @Get(':mapId/figure')
  @TeamMember()
  @ApiProduces('image/svg+xml', 'application/pdf', 'image/png')
  @ApiQuery({ name: 'format', enum: FIGURE_FORMATS })
  @ApiQuery({ name: 'widthMm', required: false, description: '40 to 300; 88 single column, 180 double' })
  @ApiQuery({ name: 'dpi', required: false, enum: ['300', '600'], description: 'PNG only' })
  async figure(
    @Param('fitId') fitId: string,
    @Param('mapId') mapId: string,
    @Query(new ZodValidationPipe(figureQuerySchema)) query: FigureQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return sendExportFile(res, await this.maps.figure(fitId, mapId, query));
  }
}
