import { Body, Controller, Get, HttpCode, Param, Post, Query, Res, StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { Prediction } from '@limbus/geometry';
import {
  type OffsetFromFitAnswer,
  offsetFromFitAnswerSchema,
  type OffsetFromFitPayload,
  offsetFromFitPayloadSchema,
  type PlacementAnswer,
  placementAnswerSchema,
  type PlacementQuery,
  placementQuerySchema,
  type PredictionMap,
  predictionMapSchema,
} from '@limbus/schema';
import type { Response } from 'express';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { setAttachment } from '../common/content-disposition';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { FIGURE_FORMATS } from '../exports/export-query';
import { Roles, TeamMember } from '../teams/roles.decorator';
import {
  type MapFile,
  MapExportsService,
  type MapFigureQuery,
  mapFigureQuerySchema,
} from './map-exports.service';
import { placementOf } from './placement';
import { predictionMapOf } from './prediction-map';
import { PredictionService } from './prediction.service';

function send(res: Response, file: MapFile): StreamableFile {
  setAttachment(res, file.fileName);
  return new StreamableFile(file.body, { type: file.contentType, length: file.body.length });
}

@ApiTags('planning')
@ApiBearerAuth()
@Controller('events/:eventId')
export class PredictionController {
  constructor(
    private readonly predictions: PredictionService,
    private readonly exports: MapExportsService,
  ) {}

  /** The limbus-prediction/1 document `limbus predict` prints for the event's exported file. */
  @Get('prediction')
  @TeamMember()
  async prediction(@Param('eventId') eventId: string): Promise<Prediction> {
    return (await this.predictions.current(eventId)).prediction;
  }

  @Post('prediction/offset-from-fit')
  @Roles('coordinator')
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(offsetFromFitPayloadSchema) })
  @ApiOkResponse({ schema: openApiSchema(offsetFromFitAnswerSchema) })
  offsetFromFit(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Body(new ZodValidationPipe(offsetFromFitPayloadSchema)) body: OffsetFromFitPayload,
  ): Promise<OffsetFromFitAnswer> {
    return this.predictions.offsetFromFit(user, eventId, body.fitId);
  }

  /** The map as data: what the client's map, the figure and the GeoJSON/KML draw. */
  @Get('prediction/map')
  @TeamMember()
  @ApiOkResponse({ schema: openApiSchema(predictionMapSchema) })
  async map(@Param('eventId') eventId: string): Promise<PredictionMap> {
    return predictionMapOf(await this.predictions.current(eventId));
  }

  @Get('prediction.geojson')
  @TeamMember()
  @ApiProduces('application/geo+json')
  async geoJson(
    @Param('eventId') eventId: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return send(res, await this.exports.geoJson(eventId));
  }

  @Get('prediction.kml')
  @TeamMember()
  @ApiProduces('application/vnd.google-earth.kml+xml')
  async kml(
    @Param('eventId') eventId: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return send(res, await this.exports.kml(eventId));
  }

  @Get('prediction/figure')
  @TeamMember()
  @ApiProduces('image/svg+xml', 'application/pdf', 'image/png')
  @ApiQuery({ name: 'format', enum: FIGURE_FORMATS })
  @ApiQuery({ name: 'widthMm', required: false, description: '40 to 300 (180 unless given)' })
  @ApiQuery({ name: 'dpi', required: false, enum: ['300', '600'], description: 'PNG only' })
  async figure(
    @Param('eventId') eventId: string,
    @Query(new ZodValidationPipe(mapFigureQuerySchema)) query: MapFigureQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return send(res, await this.exports.figure(eventId, query));
  }

  /** Cross-track offsets that fill the largest gaps, each with the nearest usable ground point. */
  @Get('placement')
  @Roles('coordinator')
  @ApiOkResponse({ schema: openApiSchema(placementAnswerSchema) })
  @ApiQuery({ name: 'sites', description: 'how many more sites, 1 to 50' })
  @ApiQuery({ name: 'ringsToo', required: false, enum: ['true', 'false'] })
  @ApiQuery({ name: 'region', required: false, description: 'latMin,latMax,lonMin,lonMax (degrees)' })
  async placement(
    @Param('eventId') eventId: string,
    @Query(new ZodValidationPipe(placementQuerySchema)) query: PlacementQuery,
  ): Promise<PlacementAnswer> {
    return placementOf(await this.predictions.current(eventId), query);
  }
}
