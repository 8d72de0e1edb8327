import { InjectQueue } from '@nestjs/bullmq';
import { EntityManager } from '@mikro-orm/mariadb';
import { Controller, Get, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Queue } from 'bullmq';
import type { Response } from 'express';
import { Public } from '../auth/public.decorator';
import { FITS_QUEUE } from '../queue/queue.module';
import { StorageService } from '../storage/storage.service';

type Up = 'up' | 'down';

export interface HealthView {
  status: 'ok' | 'degraded';
  db: Up;
  queue: Up;
  storage: Up;
}

/** A probe that hangs (e.g. an unreachable host) must not hang the health check with it. */
async function probe(check: () => Promise<unknown>, timeoutMs = 2000): Promise<Up> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error('timeout')), timeoutMs);
  });
  try {
    await Promise.race([check(), timeout]);
    return 'up';
  } catch {
    return 'down';
  } finally {
    clearTimeout(timer);
  }
}

@ApiTags('health')
@Public()
@Controller('health')
export class HealthController {
  constructor(
    private readonly em: EntityManager,
    @InjectQueue(FITS_QUEUE) private readonly queue: Queue,
    private readonly storage: StorageService,
  ) {}

  /** 503 when degraded, so a load balancer or start script can use the status code alone. */
  @Get()
  async health(@Res({ passthrough: true }) res: Response): Promise<HealthView> {
    const [db, queue, storage] = await Promise.all([
      probe(() => this.em.getConnection().execute('select 1')),
      // A real round trip to Redis; waitUntilReady() would only report the first connection.
      probe(() => this.queue.getJobCounts('waiting')),
      probe(async () => {
        if (!(await this.storage.ping())) throw new Error('bucket unreachable');
      }),
    ]);
    const status = db === 'up' && queue === 'up' && storage === 'up' ? 'ok' : 'degraded';
    if (status === 'degraded') res.status(503);
    return { status, db, queue, storage };
  }
}
