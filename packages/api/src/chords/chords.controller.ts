import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  Patch,
  Post,
  Query,
  Res,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiQuery, ApiTags } from '@nestjs/swagger';
import type { ChordInput } from '@limbus/geometry';
import { chordPayloadSchema } from '@limbus/schema';
import type { Response } from 'express';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { ValidationError } from '../common/domain-errors';
import { openApiSchema } from '../common/zod-validation.pipe';
import type { ChordView } from '../events/views';
import { Roles, TeamMember } from '../teams/roles.decorator';
import type { UploadedPart } from '../uploads/uploaded-part';
import { ChordsService } from './chords.service';

export const CHORD_CSV_LIMIT_BYTES = 1024 * 1024;

@ApiTags('chords')
@ApiBearerAuth()
@Controller()
export class ChordsController {
  constructor(private readonly chords: ChordsService) {}

  @Get('events/:eventId/chords')
  @TeamMember()
  list(@Param('eventId') eventId: string): Promise<readonly ChordView[]> {
    return this.chords.list(eventId);
  }

  @Post('events/:eventId/chords')
  @Roles('coordinator', 'modeller')
  @ApiBody({ schema: openApiSchema(chordPayloadSchema) })
  create(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Body() body: unknown,
  ): Promise<ChordView> {
    // Checked by the service with the event file's chord schema, which names the chord by its index.
    return this.chords.create(user, eventId, body);
  }

  @Post('events/:eventId/chords/import')
  @Roles('coordinator', 'modeller')
  @ApiConsumes('multipart/form-data')
  @ApiQuery({ name: 'preview', required: false, description: '1: parse and check only, write nothing' })
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: { file: { type: 'string', format: 'binary' } },
    },
  })
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: CHORD_CSV_LIMIT_BYTES, files: 1 } }))
  async import(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @UploadedFile() file: UploadedPart | undefined,
    @Query('preview') preview: string | undefined,
    @Res({ passthrough: true }) res: Response,
  ): Promise<{ chords: ChordInput[]; ids: string[] }> {
    const isPreview = preview === '1' || preview === 'true';
    const result = await this.chords.importCsv(user, eventId, file?.buffer.toString('utf8'), isPreview);
    res.status(isPreview ? 200 : 201);
    return result;
  }

  @Patch('chords/:chordId')
  @Roles('coordinator', 'modeller')
  @ApiBody({ schema: openApiSchema(chordPayloadSchema) })
  update(
    @CurrentUser() user: AuthUser,
    @Param('chordId') chordId: string,
    @Body() body: unknown,
  ): Promise<ChordView> {
    if (typeof body !== 'object' || body === null || Array.isArray(body))
      throw new ValidationError([{ path: '(body)', message: 'expected an object' }]);
    return this.chords.update(user, chordId, body as Record<string, unknown>);
  }

  @Delete('chords/:chordId')
  @Roles('coordinator', 'modeller')
  @HttpCode(204)
  async remove(@CurrentUser() user: AuthUser, @Param('chordId') chordId: string): Promise<void> {
    await this.chords.remove(user, chordId);
  }
}
