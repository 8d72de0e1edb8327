import { MikroORM } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable, Logger } from '@nestjs/common';
import type { Queue } from 'bullmq';
import { OrphanSweep } from '../queue/orphan-sweep';
import { CHI2_MAPS_QUEUE, type Chi2MapJobData, enqueueChi2Map } from './chi2-maps-queue';
import { Chi2MapRun } from './entities/chi2-map-run.entity';

/** Queues again the maps stored as queued or running whose job cannot finish them (see OrphanSweep). */
@Injectable()
export class Chi2MapRequeue extends OrphanSweep {
  protected readonly logger = new Logger(Chi2MapRequeue.name);

  constructor(
    private readonly orm: MikroORM,
    @InjectQueue(CHI2_MAPS_QUEUE) protected readonly queue: Queue<Chi2MapJobData>,
  ) {
    super();
  }

  protected async unfinishedIds(before: Date, limit: number): Promise<string[]> {
    const rows = await this.orm.em
      .fork()
      .find(
        Chi2MapRun,
        { state: { $in: ['queued', 'running'] }, createdAt: { $lt: before } },
        { fields: ['id'], orderBy: { createdAt: 'asc' }, limit },
      );
    return rows.map((r) => r.id);
  }

  protected async isUnfinished(id: string): Promise<boolean> {
    const row = await this.orm.em.fork().findOne(Chi2MapRun, { id }, { fields: ['state'] });
    return row?.state === 'queued' || row?.state === 'running';
  }

  protected enqueue(id: string): Promise<unknown> {
    return enqueueChi2Map(this.queue, id);
  }
}
