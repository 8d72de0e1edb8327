import { EntityManager } from '@mikro-orm/mariadb';
import { Controller, Get, Param } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { Roles } from '../teams/roles.decorator';
import { type AuditView, AuditService } from './audit.service';

@ApiTags('audit')
@ApiBearerAuth()
@Controller()
export class AuditController {
  constructor(
    private readonly audit: AuditService,
    private readonly em: EntityManager,
  ) {}

  @Get('events/:eventId/audit')
  @Roles('coordinator')
  list(@Param('eventId') eventId: string): Promise<AuditView[]> {
    return this.audit.forEvent(this.em, eventId);
  }
}
