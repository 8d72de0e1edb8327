import { Module, OnModuleInit } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { EventsModule } from '../events/events.module';
import { MailModule } from '../mail/mail.module';
import { TeamScopeRegistry } from '../teams/team-scope.registry';
import { TeamsModule } from '../teams/teams.module';
import { CorrectionsService } from './corrections.service';
import { Report } from './entities/report.entity';
import { ReportNotices } from './report-notices';
import { ReportsController } from './reports.controller';
import { ReportsService } from './reports.service';

@Module({
  imports: [TeamsModule, EventsModule, AuditModule, MailModule],
  controllers: [ReportsController],
  providers: [ReportsService, CorrectionsService, ReportNotices],
  exports: [ReportsService],
})
export class ReportsModule implements OnModuleInit {
  constructor(private readonly registry: TeamScopeRegistry) {}

  onModuleInit(): void {
    this.registry.register('reportId', async (reportId, em) => {
      const report = await em.findOne(
        Report,
        { id: reportId },
        { populate: ['event'], fields: ['event.team'] },
      );
      return report?.event.team.id ?? null;
    });
  }
}
