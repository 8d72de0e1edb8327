import { BullModule } from '@nestjs/bullmq';
import { Module } from '@nestjs/common';
import { JOINT_QUEUE } from '../comparisons/joint-queue';
import { TeamsModule } from '../teams/teams.module';
import { ShapesController } from './shapes.controller';
import { ShapesService } from './shapes.service';

/** A body's 3D shape from several fits' limbs. The joint queue is read only, for a solved joint ring pole. */
@Module({
  imports: [TeamsModule, BullModule.registerQueue({ name: JOINT_QUEUE })],
  controllers: [ShapesController],
  providers: [ShapesService],
})
export class ShapesModule {}
