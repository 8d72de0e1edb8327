import { Controller, Get } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { outboxMessageSchema } from '@limbus/schema';
import { z } from 'zod';
import { openApiSchema } from '../common/zod-validation.pipe';
import { AdminOnly } from '../teams/roles.decorator';
import { type OutboxMessage, OutboxService } from './outbox.service';

@ApiTags('admin')
@ApiBearerAuth()
@AdminOnly()
@Controller('admin')
export class AdminController {
  constructor(private readonly outbox: OutboxService) {}

  /** Newest first; `kind` is the X-Limbus-Kind header of each message, null for other mail. */
  @Get('outbox')
  @ApiOkResponse({ schema: openApiSchema(z.array(outboxMessageSchema)) })
  messages(): Promise<OutboxMessage[]> {
    return this.outbox.messages();
  }
}
