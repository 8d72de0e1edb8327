import {
  Controller,
  Get,
  Param,
  Post,
  Res,
  StreamableFile,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { setAttachment } from '../common/content-disposition';
import type { ReportView } from '../reports/report-view';
import { TeamMember } from '../teams/roles.decorator';
import type { UploadedPart } from './uploaded-part';
import { LIGHT_CURVE_FILE_NAME, UploadsService } from './uploads.service';

/** A light curve of a few minutes at video rate is well under this; larger answers 413. */
export const LIGHT_CURVE_LIMIT_BYTES = 2 * 1024 * 1024;

@ApiTags('uploads')
@ApiBearerAuth()
@Controller('reports/:reportId/light-curve')
export class UploadsController {
  constructor(private readonly uploads: UploadsService) {}

  @Post()
  @TeamMember()
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: { file: { type: 'string', format: 'binary' } },
    },
  })
  // busboy reads a part's plain `filename="…"` as Latin-1 unless told otherwise; browsers send UTF-8.
  @UseInterceptors(
    FileInterceptor('file', {
      limits: { fileSize: LIGHT_CURVE_LIMIT_BYTES, files: 1 },
      defParamCharset: 'utf8',
    }),
  )
  attach(
    @CurrentUser() user: AuthUser,
    @Param('reportId') reportId: string,
    @UploadedFile() file: UploadedPart | undefined,
  ): Promise<ReportView> {
    return this.uploads.attachLightCurve(user, reportId, file);
  }

  @Get()
  @TeamMember()
  async download(
    @CurrentUser() user: AuthUser,
    @Param('reportId') reportId: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<StreamableFile> {
    const { upload, bytes } = await this.uploads.lightCurve(user, reportId);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    setAttachment(res, upload.name, LIGHT_CURVE_FILE_NAME);
    return new StreamableFile(bytes);
  }
}
