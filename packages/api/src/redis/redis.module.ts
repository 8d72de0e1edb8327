import { Global, Inject, Injectable, Module, OnApplicationShutdown } from '@nestjs/common';
import { Redis } from 'ioredis';
import { AppConfig } from '../config/app-config';
import { redisOptions } from './redis-options';

export const REDIS = Symbol('REDIS');

@Injectable()
class RedisCloser implements OnApplicationShutdown {
  constructor(@Inject(REDIS) private readonly redis: Redis) {}

  async onApplicationShutdown(): Promise<void> {
    await this.redis.quit().catch(() => this.redis.disconnect());
  }
}

/** One shared client for counters (sign-in failures); BullMQ opens its own connections. */
@Global()
@Module({
  providers: [
    {
      provide: REDIS,
      inject: [AppConfig],
      useFactory: (config: AppConfig) =>
        new Redis({ ...redisOptions(config.redisUrl), maxRetriesPerRequest: 2 }),
    },
    RedisCloser,
  ],
  exports: [REDIS],
})
export class RedisModule {}
