import { describe, expect, it } from 'vitest';
import type { FailureCounterStore } from './login-rate-limiter';
import { resetClientKey, resetEmailKey, ResetRequestThrottle } from './reset-request-throttle';

/** Counts per key; windows never end here (their expiry is Redis's, checked in the login limiter spec). */
class CountingStore implements FailureCounterStore {
  readonly counts = new Map<string, number>();
  async hit(key: string): Promise<number> {
    const count = (this.counts.get(key) ?? 0) + 1;
    this.counts.set(key, count);
    return count;
  }
  async peek(key: string): Promise<{ count: number; ttlSeconds: number }> {
    return { count: this.counts.get(key) ?? 0, ttlSeconds: 0 };
  }
  async clear(key: string): Promise<void> {
    this.counts.delete(key);
  }
}

const limits = { perEmail: 3, perClient: 5, windowSeconds: 3600 };

describe('ResetRequestThrottle', () => {
  it('ResetRequestThrottle.admit() lets perEmail requests for one address through, then none', async () => {
    const throttle = new ResetRequestThrottle(new CountingStore(), limits);
    const answers = [];
    for (let i = 0; i < 5; i++) answers.push(await throttle.admit('Ada@Example.org', `192.0.2.${i}`));
    expect(answers).toEqual([true, true, true, false, false]);
  });

  it('ResetRequestThrottle.admit() lets perClient requests from one client through, whatever the addresses', async () => {
    const throttle = new ResetRequestThrottle(new CountingStore(), limits);
    const answers = [];
    for (let i = 0; i < 7; i++) answers.push(await throttle.admit(`person${i}@example.org`, '192.0.2.9'));
    expect(answers).toEqual([true, true, true, true, true, false, false]);
  });

  it('ResetRequestThrottle.admit() counts an address case-insensitively, like the accounts', async () => {
    const store = new CountingStore();
    const throttle = new ResetRequestThrottle(store, limits);
    await throttle.admit('Ada@Example.org', '192.0.2.1');
    await throttle.admit('ada@example.org', '192.0.2.2');
    expect(store.counts.get(resetEmailKey('ADA@EXAMPLE.ORG'))).toBe(2);
    expect(store.counts.get(resetClientKey('192.0.2.1'))).toBe(1);
  });
});
