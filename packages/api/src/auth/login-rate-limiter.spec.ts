import { describe, expect, it } from 'vitest';
import { TooManyRequestsError } from '../common/domain-errors';
import { accountKey, type FailureCounterStore, LoginRateLimiter } from './login-rate-limiter';

/** In-memory store with a hand-driven clock, so window expiry is tested without waiting. */
class ClockedStore implements FailureCounterStore {
  nowSeconds = 0;
  private readonly windows = new Map<string, { count: number; endsAt: number }>();

  async hit(key: string, windowSeconds: number): Promise<number> {
    const w = this.live(key);
    if (w) return (w.count += 1);
    this.windows.set(key, { count: 1, endsAt: this.nowSeconds + windowSeconds });
    return 1;
  }

  async peek(key: string): Promise<{ count: number; ttlSeconds: number }> {
    const w = this.live(key);
    return w ? { count: w.count, ttlSeconds: w.endsAt - this.nowSeconds } : { count: 0, ttlSeconds: 0 };
  }

  async clear(key: string): Promise<void> {
    this.windows.delete(key);
  }

  private live(key: string): { count: number; endsAt: number } | undefined {
    const w = this.windows.get(key);
    if (w && w.endsAt <= this.nowSeconds) {
      this.windows.delete(key);
      return undefined;
    }
    return w;
  }
}

const limits = { perAccount: 5, perAddress: 8, windowSeconds: 900 };

async function fail(limiter: LoginRateLimiter, email: string, address: string, times: number): Promise<void> {
  for (let i = 0; i < times; i += 1) await limiter.recordFailure(email, address);
}

describe('LoginRateLimiter', () => {
  it('assertAllowed() lets the fifth attempt through after four failures and refuses the sixth after five', async () => {
    const store = new ClockedStore();
    const limiter = new LoginRateLimiter(store, limits);
    await fail(limiter, 'a@example.org', '10.0.0.1', 4);
    await expect(limiter.assertAllowed('a@example.org', '10.0.0.1')).resolves.toBeUndefined();
    await fail(limiter, 'a@example.org', '10.0.0.1', 1);
    await expect(limiter.assertAllowed('a@example.org', '10.0.0.1')).rejects.toBeInstanceOf(
      TooManyRequestsError,
    );
  });

  it('assertAllowed() reports the seconds left in the window as Retry-After', async () => {
    const store = new ClockedStore();
    const limiter = new LoginRateLimiter(store, limits);
    await fail(limiter, 'a@example.org', '10.0.0.1', 5);
    store.nowSeconds = 600;
    const error = await limiter.assertAllowed('a@example.org', '10.0.0.1').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(TooManyRequestsError);
    expect((error as TooManyRequestsError).retryAfterSeconds).toBe(300);
  });

  it('assertAllowed() allows again once the window has passed', async () => {
    const store = new ClockedStore();
    const limiter = new LoginRateLimiter(store, limits);
    await fail(limiter, 'a@example.org', '10.0.0.1', 5);
    store.nowSeconds = 900;
    await expect(limiter.assertAllowed('a@example.org', '10.0.0.1')).resolves.toBeUndefined();
  });

  it('assertAllowed() limits one address trying many accounts', async () => {
    const limiter = new LoginRateLimiter(new ClockedStore(), limits);
    for (let i = 0; i < 8; i += 1) await limiter.recordFailure(`user${i}@example.org`, '10.0.0.9');
    await expect(limiter.assertAllowed('fresh@example.org', '10.0.0.9')).rejects.toBeInstanceOf(
      TooManyRequestsError,
    );
    await expect(limiter.assertAllowed('fresh@example.org', '10.0.0.10')).resolves.toBeUndefined();
  });

  it('assertAllowed() treats e-mail case as the same account', async () => {
    const limiter = new LoginRateLimiter(new ClockedStore(), limits);
    await fail(limiter, 'Case@Example.org', '10.0.0.1', 3);
    await fail(limiter, 'case@example.org', '10.0.0.2', 2);
    await expect(limiter.assertAllowed('CASE@example.org', '10.0.0.3')).rejects.toBeInstanceOf(
      TooManyRequestsError,
    );
  });

  it('recordSuccess() clears the account counter but not the address counter', async () => {
    const store = new ClockedStore();
    const limiter = new LoginRateLimiter(store, limits);
    await fail(limiter, 'a@example.org', '10.0.0.1', 4);
    await limiter.recordSuccess('a@example.org');
    expect((await store.peek(accountKey('a@example.org'))).count).toBe(0);
    await fail(limiter, 'a@example.org', '10.0.0.1', 4);
    await expect(limiter.assertAllowed('a@example.org', '10.0.0.2')).resolves.toBeUndefined();
    await expect(limiter.assertAllowed('b@example.org', '10.0.0.1')).rejects.toBeInstanceOf(
      TooManyRequestsError,
    );
  });
});
