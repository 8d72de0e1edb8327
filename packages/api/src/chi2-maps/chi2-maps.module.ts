import { BullModule } from '@nestjs/bullmq';
import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { FitsModule } from '../fits/fits.module';
import { TeamsModule } from '../teams/teams.module';
import { Chi2MapsController } from './chi2-maps.controller';
import { Chi2MapsService } from './chi2-maps.service';
import { CHI2_MAPS_QUEUE } from './chi2-maps-queue';

/** API side: ask for a fit's χ² map, read it, download it. Team scope comes from :fitId. */
@Module({
  imports: [TeamsModule, AuditModule, FitsModule, BullModule.registerQueue({ name: CHI2_MAPS_QUEUE })],
  controllers: [Chi2MapsController],
  providers: [Chi2MapsService],
})
export class Chi2MapsModule {}
