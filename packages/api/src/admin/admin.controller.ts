import { Controller, Get } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { AdminOnly } from '../teams/roles.decorator';
import { type OutboxMessage, OutboxService } from './outbox.service';

@ApiTags('admin')
@ApiBearerAuth()
@AdminOnly()
@Controller('admin')
export class AdminController {
  constructor(private readonly outbox: OutboxService) {}

  @Get('outbox')
  messages(): Promise<OutboxMessage[]> {
    return this.outbox.messages();
  }
}
