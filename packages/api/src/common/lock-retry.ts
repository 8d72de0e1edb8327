import { DeadlockException, LockWaitTimeoutException } from '@mikro-orm/core';

/** A transaction InnoDB rolled back to break a deadlock, or gave up waiting for a row lock. */
export function isLockConflict(error: unknown): boolean {
  return error instanceof DeadlockException || error instanceof LockWaitTimeoutException;
}

/**
 * Runs `work` (one whole transaction) again when InnoDB chose it as a deadlock victim or its lock wait
 * timed out: the transaction was rolled back, so running it again is safe, and it is what MariaDB's
 * manual tells applications to do ("InnoDB deadlocks": always be prepared to re-issue a transaction).
 * After `attempts` tries the last error goes to the caller, which answers it in its own terms.
 */
export async function retryOnLockConflict<T>(work: () => Promise<T>, attempts = 4): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await work();
    } catch (error) {
      if (!isLockConflict(error) || attempt >= attempts) throw error;
      // A short random pause so that the transactions that met do not meet again at once.
      await new Promise((resolve) => setTimeout(resolve, Math.random() * 20 * attempt));
    }
  }
}
