import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  Patch,
  Post,
  Res,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { EventInput } from '@limbus/geometry';
import {
  type CreateEventPayload,
  createEventPayloadSchema,
  type PatchEventPayload,
  patchEventPayloadSchema,
} from '@limbus/schema';
import type { Response } from 'express';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import type { UploadedPart } from '../uploads/uploaded-part';
import { type EventDetail, type EventSummary, EventsService } from './events.service';

/** An event file is a few hundred kB at most; anything larger is not one. */
export const EVENT_FILE_LIMIT_BYTES = 5 * 1024 * 1024;

@ApiTags('events')
@ApiBearerAuth()
@Controller('events')
export class EventsController {
  constructor(private readonly events: EventsService) {}

  @Get()
  list(@CurrentUser() user: AuthUser): Promise<EventSummary[]> {
    return this.events.list(user);
  }

  /** Team comes in the body, so the role check happens in the service (coordinator of that team). */
  @Post()
  @ApiBody({ schema: openApiSchema(createEventPayloadSchema) })
  create(
    @CurrentUser() user: AuthUser,
    @Body(new ZodValidationPipe(createEventPayloadSchema)) body: CreateEventPayload,
  ): Promise<{ id: string }> {
    return this.events.create(user, body);
  }

  @Post('import')
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: { file: { type: 'string', format: 'binary' }, teamId: { type: 'string' } },
    },
  })
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: EVENT_FILE_LIMIT_BYTES, files: 1 } }))
  import(
    @CurrentUser() user: AuthUser,
    @UploadedFile() file: UploadedPart | undefined,
    @Body() body: Record<string, unknown> | undefined,
  ): Promise<{ id: string }> {
    const teamId = typeof body?.teamId === 'string' && body.teamId !== '' ? body.teamId : undefined;
    return this.events.importFile(user, teamId, file?.buffer);
  }

  @Get(':eventId')
  @TeamMember()
  one(@Param('eventId') eventId: string): Promise<EventDetail> {
    return this.events.detail(eventId);
  }

  @Patch(':eventId')
  @Roles('coordinator', 'modeller')
  @ApiBody({ schema: openApiSchema(patchEventPayloadSchema) })
  update(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Body(new ZodValidationPipe(patchEventPayloadSchema)) body: PatchEventPayload,
  ): Promise<EventDetail> {
    return this.events.update(user, eventId, body);
  }

  @Delete(':eventId')
  @Roles('coordinator')
  @HttpCode(204)
  async remove(@CurrentUser() user: AuthUser, @Param('eventId') eventId: string): Promise<void> {
    await this.events.softDelete(user, eventId);
  }

  @Post(':eventId/restore')
  @Roles('coordinator')
  @HttpCode(200)
  restore(@CurrentUser() user: AuthUser, @Param('eventId') eventId: string): Promise<EventDetail> {
    return this.events.restore(user, eventId);
  }

  @Get(':eventId/export')
  @TeamMember()
  async export(
    @Param('eventId') eventId: string,
    @Res({ passthrough: true }) res: Response,
  ): Promise<EventInput> {
    const file = await this.events.exportFile(eventId);
    res.setHeader('Content-Disposition', `attachment; filename="event-${eventId}.json"`);
    return file;
  }
}
