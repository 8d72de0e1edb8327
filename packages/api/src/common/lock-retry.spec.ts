import { DeadlockException, LockWaitTimeoutException } from '@mikro-orm/core';
import { describe, expect, it } from 'vitest';
import { retryOnLockConflict } from './lock-retry';

/** Work that fails with the given errors, one per call, then answers "done". */
function failing(errors: Error[]): { work: () => Promise<string>; calls: () => number } {
  let calls = 0;
  return {
    work: async () => {
      const error = errors[calls++];
      if (error) throw error;
      return 'done';
    },
    calls: () => calls,
  };
}

describe('retryOnLockConflict()', () => {
  it('retryOnLockConflict() runs the work again after a deadlock and a lock wait timeout', async () => {
    const { work, calls } = failing([
      new DeadlockException(new Error('Deadlock found when trying to get lock')),
      new LockWaitTimeoutException(new Error('Lock wait timeout exceeded')),
    ]);
    await expect(retryOnLockConflict(work)).resolves.toBe('done');
    expect(calls()).toBe(3);
  });

  it('retryOnLockConflict() gives the last lock conflict to the caller after the attempts', async () => {
    const deadlock = () => new DeadlockException(new Error('Deadlock found when trying to get lock'));
    const { work, calls } = failing([deadlock(), deadlock(), deadlock()]);
    await expect(retryOnLockConflict(work, 3)).rejects.toBeInstanceOf(DeadlockException);
    expect(calls()).toBe(3);
  });

  it('retryOnLockConflict() does not run the work again after any other error', async () => {
    const { work, calls } = failing([new Error('duplicate entry')]);
    await expect(retryOnLockConflict(work)).rejects.toThrow('duplicate entry');
    expect(calls()).toBe(1);
  });
});
