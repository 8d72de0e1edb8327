import { BullModule } from '@nestjs/bullmq';
import { Module, OnModuleInit } from '@nestjs/common';
import { EventsModule } from '../events/events.module';
import { TeamScopeRegistry } from '../teams/team-scope.registry';
import { TeamsModule } from '../teams/teams.module';
import { ComparisonsController } from './comparisons.controller';
import { ComparisonsService } from './comparisons.service';
import { JOINT_QUEUE } from './joint-queue';

/** Comparison across the fits of one body and the queued joint ring pole (the API side). */
@Module({
  imports: [TeamsModule, EventsModule, BullModule.registerQueue({ name: JOINT_QUEUE })],
  controllers: [ComparisonsController],
  providers: [ComparisonsService],
})
export class ComparisonsModule implements OnModuleInit {
  constructor(
    private readonly registry: TeamScopeRegistry,
    private readonly comparisons: ComparisonsService,
  ) {}

  onModuleInit(): void {
    // A joint job lives in the queue, not a table; its data names the team it was submitted for.
    this.registry.register('jointId', (jointId) => this.comparisons.teamOfJoint(jointId));
  }
}
