import { TooManyRequestsError } from '../common/domain-errors';

/** A counter that expires `windowSeconds` after its first hit (a fixed window per key). */
export interface FailureCounterStore {
  /** Counts one hit and resolves to the count in the window, this hit included. */
  hit(key: string, windowSeconds: number): Promise<number>;
  /** Current count and seconds until the window ends; count 0 when there is no window. */
  peek(key: string): Promise<{ count: number; ttlSeconds: number }>;
  clear(key: string): Promise<void>;
}

export interface LoginRateLimits {
  perAccount: number;
  perAddress: number;
  windowSeconds: number;
}

export const accountKey = (email: string): string => `login-fail:account:${email.toLowerCase()}`;
export const addressKey = (address: string): string => `login-fail:address:${address}`;

/**
 * Counts failed sign-ins per account (stops guessing one password) and per client address (stops
 * one client trying many accounts). Only failures count, so a user who signs in often is never
 * locked out; a success clears that account's counter.
 */
export class LoginRateLimiter {
  constructor(
    private readonly store: FailureCounterStore,
    private readonly limits: LoginRateLimits,
  ) {}

  /** Throws TooManyRequestsError, carrying Retry-After, when either counter is at its limit. */
  async assertAllowed(email: string, address: string): Promise<void> {
    const [account, client] = await Promise.all([
      this.store.peek(accountKey(email)),
      this.store.peek(addressKey(address)),
    ]);
    const waits: number[] = [];
    if (account.count >= this.limits.perAccount) waits.push(account.ttlSeconds);
    if (client.count >= this.limits.perAddress) waits.push(client.ttlSeconds);
    if (waits.length > 0) throw new TooManyRequestsError(Math.max(1, ...waits));
  }

  async recordFailure(email: string, address: string): Promise<void> {
    await Promise.all([
      this.store.hit(accountKey(email), this.limits.windowSeconds),
      this.store.hit(addressKey(address), this.limits.windowSeconds),
    ]);
  }

  async recordSuccess(email: string): Promise<void> {
    await this.store.clear(accountKey(email));
  }
}
