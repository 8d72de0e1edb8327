import { MikroORM } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable, Logger } from '@nestjs/common';
import type { Queue } from 'bullmq';
import { OrphanSweep } from '../queue/orphan-sweep';
import { LightCurveTiming } from './entities/light-curve-timing.entity';
import { enqueueTiming, TIMINGS_QUEUE, type TimingJobData } from './timings-queue';

/** Queues again the timings stored as queued or running whose job cannot finish them (see OrphanSweep). */
@Injectable()
export class TimingRequeue extends OrphanSweep {
  protected readonly logger = new Logger(TimingRequeue.name);

  constructor(
    private readonly orm: MikroORM,
    @InjectQueue(TIMINGS_QUEUE) protected readonly queue: Queue<TimingJobData>,
  ) {
    super();
  }

  protected async unfinishedIds(before: Date, limit: number): Promise<string[]> {
    const rows = await this.orm.em
      .fork()
      .find(
        LightCurveTiming,
        { state: { $in: ['queued', 'running'] }, createdAt: { $lt: before } },
        { fields: ['id'], orderBy: { createdAt: 'asc' }, limit },
      );
    return rows.map((r) => r.id);
  }

  protected async isUnfinished(id: string): Promise<boolean> {
    const row = await this.orm.em.fork().findOne(LightCurveTiming, { id }, { fields: ['state'] });
    return row?.state === 'queued' || row?.state === 'running';
  }

  protected enqueue(id: string): Promise<unknown> {
    return enqueueTiming(this.queue, id);
  }
}
