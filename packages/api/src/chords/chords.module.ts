import { Module, OnModuleInit } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { EventsModule } from '../events/events.module';
import { TeamScopeRegistry } from '../teams/team-scope.registry';
import { TeamsModule } from '../teams/teams.module';
import { ChordsController } from './chords.controller';
import { ChordsService } from './chords.service';
import { Chord } from './entities/chord.entity';

@Module({
  imports: [TeamsModule, EventsModule, AuditModule],
  controllers: [ChordsController],
  providers: [ChordsService],
})
export class ChordsModule implements OnModuleInit {
  constructor(private readonly registry: TeamScopeRegistry) {}

  onModuleInit(): void {
    this.registry.register('chordId', async (chordId, em) => {
      const chord = await em.findOne(Chord, { id: chordId }, { populate: ['event'], fields: ['event.team'] });
      return chord?.event.team.id ?? null;
    });
  }
}
