import { MikroORM } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable, Logger } from '@nestjs/common';
import type { Queue } from 'bullmq';
import { OrphanSweep } from '../queue/orphan-sweep';
import { FITS_QUEUE } from '../queue/queue.module';
import { FitRun } from './entities/fit-run.entity';
import { enqueueFit, type FitJobData } from './fit-queue';

/** Queues again the fits stored as queued or running whose job cannot finish them (see OrphanSweep). */
@Injectable()
export class FitRequeue extends OrphanSweep {
  protected readonly logger = new Logger(FitRequeue.name);

  constructor(
    private readonly orm: MikroORM,
    @InjectQueue(FITS_QUEUE) protected readonly queue: Queue<FitJobData>,
  ) {
    super();
  }

  protected async unfinishedIds(before: Date, limit: number): Promise<string[]> {
    const rows = await this.orm.em
      .fork()
      .find(
        FitRun,
        { state: { $in: ['queued', 'running'] }, createdAt: { $lt: before } },
        { fields: ['id'], orderBy: { createdAt: 'asc' }, limit },
      );
    return rows.map((r) => r.id);
  }

  protected async isUnfinished(id: string): Promise<boolean> {
    const row = await this.orm.em.fork().findOne(FitRun, { id }, { fields: ['state'] });
    return row?.state === 'queued' || row?.state === 'running';
  }

  protected enqueue(id: string): Promise<unknown> {
    return enqueueFit(this.queue, id);
  }
}
