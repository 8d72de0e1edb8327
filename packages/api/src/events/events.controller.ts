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
import { ApiBearerAuth, ApiBody, ApiConsumes, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { EventInput } from '@limbus/geometry';
import {
  type CreateEventPayload,
  createEventPayloadSchema,
  type EventsPage,
  eventsPageSchema,
  type EventsQuery,
  eventsQuerySchema,
  importFieldsSchema,
  type PatchEventPayload,
  patchEventPayloadSchema,
} from '@limbus/schema';
import type { Response } from 'express';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { setAttachment } from '../common/content-disposition';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import type { UploadedPart } from '../uploads/uploaded-part';
import { ValidationError } from '../common/domain-errors';
import { type EventDetail, EventsService, type ImportFields } from './events.service';

/** The text fields of an import's multipart body, each checked like its JSON twin. */
function importFields(body: Record<string, unknown> | undefined): ImportFields {
  const text = (key: string) => {
    const value = body?.[key];
    return typeof value === 'string' && value.trim() !== '' ? value : undefined;
  };
  const fields = { teamId: text('teamId'), bodyId: text('bodyId'), bodyName: text('bodyName') };
  const checked = importFieldsSchema.safeParse(fields);
  if (!checked.success)
    throw new ValidationError(
      checked.error.issues.map((issue) => ({
        path: issue.path.map(String).join('.'),
        message: issue.message,
      })),
    );
  return checked.data;
}

/** An event file is a few hundred kB at most; anything larger is not one. */
export const EVENT_FILE_LIMIT_BYTES = 5 * 1024 * 1024;

@ApiTags('events')
@ApiBearerAuth()
@Controller('events')
export class EventsController {
  constructor(private readonly events: EventsService) {}

  /** One page of the events of the caller's teams; see eventsQuerySchema for the filters. */
  @Get()
  @ApiOkResponse({ schema: openApiSchema(eventsPageSchema) })
  list(
    @CurrentUser() user: AuthUser,
    @Query(new ZodValidationPipe(eventsQuerySchema)) query: EventsQuery,
  ): Promise<EventsPage> {
    return this.events.list(user, query);
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
      properties: {
        file: { type: 'string', format: 'binary' },
        teamId: { type: 'string' },
        bodyId: { type: 'string', description: 'a body of the team' },
        bodyName: { type: 'string', description: 'a body found or made by name; else the file may name one' },
      },
    },
  })
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: EVENT_FILE_LIMIT_BYTES, files: 1 } }))
  import(
    @CurrentUser() user: AuthUser,
    @UploadedFile() file: UploadedPart | undefined,
    @Body() body: Record<string, unknown> | undefined,
  ): Promise<{ id: string }> {
    return this.events.importFile(user, importFields(body), file?.buffer);
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
  ): Promise<EventInput & { body: { name: string } }> {
    const file = await this.events.exportFile(eventId);
    setAttachment(res, `event-${eventId}.json`);
    return file;
  }
}
