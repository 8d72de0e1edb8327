import type { Redis } from 'ioredis';
import type { FailureCounterStore } from './login-rate-limiter';

/**
 * Failure and request counters live in Redis rather than a table: they are short-lived, shared by every API
 * process, and expire by themselves.
 */
export class RedisFailureCounterStore implements FailureCounterStore {
  constructor(
    private readonly redis: Redis,
    private readonly prefix = 'limbus:',
  ) {}

  async hit(key: string, windowSeconds: number): Promise<number> {
    // NX keeps the window anchored at the first failure instead of sliding with every attempt.
    const results = await this.redis
      .multi()
      .incr(this.prefix + key)
      .expire(this.prefix + key, windowSeconds, 'NX')
      .exec();
    const [error, count] = results?.[0] ?? [new Error('the Redis transaction was discarded'), null];
    if (error) throw error;
    return Number(count);
  }

  async peek(key: string): Promise<{ count: number; ttlSeconds: number }> {
    const [count, ttl] = await Promise.all([
      this.redis.get(this.prefix + key),
      this.redis.ttl(this.prefix + key),
    ]);
    return { count: count === null ? 0 : Number(count), ttlSeconds: Math.max(ttl, 0) };
  }

  async clear(key: string): Promise<void> {
    await this.redis.del(this.prefix + key);
  }
}
