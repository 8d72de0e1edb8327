import { EntityManager } from '@mikro-orm/mariadb';
import { Controller, Get, Param } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { NotFoundError } from '../common/domain-errors';
import { OccultationEvent } from '../events/entities/occultation-event.entity';
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

  /** A deleted event answers 404 here as on every other route of it; restoring it brings its log back. */
  @Get('events/:eventId/audit')
  @Roles('coordinator')
  async list(@Param('eventId') eventId: string): Promise<AuditView[]> {
    const active = await this.em.count(OccultationEvent, { id: eventId, state: { $ne: 'deleted' } });
    if (active === 0) throw new NotFoundError();
    return this.audit.forEvent(this.em, eventId);
  }
}
