import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { ReportsModule } from '../reports/reports.module';
import { StorageModule } from '../storage/storage.module';
import { TeamsModule } from '../teams/teams.module';
import { UploadsController } from './uploads.controller';
import { UploadsService } from './uploads.service';

@Module({
  imports: [TeamsModule, ReportsModule, StorageModule, AuditModule],
  controllers: [UploadsController],
  providers: [UploadsService],
})
export class UploadsModule {}
