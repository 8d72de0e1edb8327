import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { EventsModule } from '../events/events.module';
import { MailModule } from '../mail/mail.module';
import { TeamsModule } from '../teams/teams.module';
import { BriefingsController } from './briefings.controller';
import { BriefingsService } from './briefings.service';
import { MapExportsService } from './map-exports.service';
import { PlanningNotices } from './planning-notices';
import { PredictionCache } from './prediction-cache';
import { PredictionController } from './prediction.controller';
import { PredictionService } from './prediction.service';
import { SiteProposalsController } from './site-proposals.controller';
import { SiteProposalsService } from './site-proposals.service';

/**
 * Before the event: the prediction of the shadow path from the event's settings, its map and exports,
 * the placement of more sites, observers' proposed sites, and the briefing of every observer. The event
 * routes resolve their team through the events module's `eventId` resolver.
 */
@Module({
  imports: [TeamsModule, EventsModule, AuditModule, MailModule],
  controllers: [PredictionController, SiteProposalsController, BriefingsController],
  providers: [
    PredictionService,
    PredictionCache,
    MapExportsService,
    BriefingsService,
    SiteProposalsService,
    PlanningNotices,
  ],
})
export class PlanningModule {}
