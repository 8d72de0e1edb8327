import { Controller, Get, Param, Query, Res, type StreamableFile } from '@nestjs/common';
import { ApiBearerAuth, ApiProduces, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { ZodValidationPipe } from '../common/zod-validation.pipe';
import { TeamMember } from '../teams/roles.decorator';
import {
  FIGURE_FORMATS,
  type FigureQuery,
  figureQuerySchema,
  TABLE_FORMATS,
  type TableQuery,
  tableQuerySchema,
} from './export-query';
import { ExportsService } from './exports.service';
import { sendExportFile } from './send-export-file';

@ApiTags('exports')
@ApiBearerAuth()
@Controller('fits/:fitId')
export class ExportsController {
  constructor(private readonly exports: ExportsService) {}

  @Get('figure')
  @TeamMember()
  @ApiProduces('image/svg+xml', 'application/pdf', 'image/png')
  @ApiQuery({ name: 'format', enum: FIGURE_FORMATS })
  @ApiQuery({ name: 'widthMm', required: false, description: '40 to 300; 88 single column, 180 double' })
  @ApiQuery({ name: 'dpi', required: false, enum: ['300', '600'], description: 'PNG only' })
  async figure(
    @Param('fitId') fitId: string,
    @Query(new ZodValidationPipe(figureQuerySchema)) query: FigureQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return sendExportFile(res, await this.exports.figure(fitId, query));
  }

  @Get('table')
  @TeamMember()
  @ApiProduces('text/csv', 'application/json', 'application/x-tex')
  @ApiQuery({ name: 'format', enum: TABLE_FORMATS })
  async table(
    @Param('fitId') fitId: string,
    @Query(new ZodValidationPipe(tableQuerySchema)) query: TableQuery,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    return sendExportFile(res, await this.exports.table(fitId, query));
  }
}
