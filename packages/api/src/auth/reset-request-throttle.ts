import type { FailureCounterStore } from './login-rate-limiter';

export interface ResetRequestLimits {
  perEmail: number;
  perClient: number;
  windowSeconds: number;
}

/**
 * Password-reset requests a client may make: a few an hour for one e-mail address (a person waiting for
 * a slow mail asks again two or three times; more is someone filling a mailbox) and a few dozen from
 * one client address (an office behind one address; more is someone trying addresses). Common practice,
 * no source. docs/authorization.md states the numbers.
 */
export const RESET_REQUEST_LIMITS: ResetRequestLimits = { perEmail: 5, perClient: 20, windowSeconds: 3600 };

export const resetEmailKey = (email: string): string => `reset-request:email:${email.toLowerCase()}`;
export const resetClientKey = (address: string): string => `reset-request:client:${address}`;

/**
 * Counts every reset request, known address or not, so that neither the answer nor the throttle tells
 * which accounts exist. A throttled request is still answered 202; it only sends nothing.
 */
export class ResetRequestThrottle {
  constructor(
    private readonly store: FailureCounterStore,
    private readonly limits: ResetRequestLimits = RESET_REQUEST_LIMITS,
  ) {}

  /** Counts this request; true when it is within both limits. */
  async admit(email: string, clientAddress: string): Promise<boolean> {
    const [forEmail, forClient] = await Promise.all([
      this.store.hit(resetEmailKey(email), this.limits.windowSeconds),
      this.store.hit(resetClientKey(clientAddress), this.limits.windowSeconds),
    ]);
    return forEmail <= this.limits.perEmail && forClient <= this.limits.perClient;
  }
}
