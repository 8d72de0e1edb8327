import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { NotFoundError } from '../../src/common/domain-errors';
import { StorageService } from '../../src/storage/storage.service';
import { bootTestApp, type TestApp } from '../setup';

describe('StorageService against the S3 endpoint', () => {
  let t: TestApp;
  let storage: StorageService;
  beforeAll(async () => {
    // A bucket of its own proves that start-up creates a missing bucket.
    t = await bootTestApp({ S3_BUCKET: `limbus-e2e-${randomBytes(4).toString('hex')}` });
    storage = t.app.get(StorageService);
  });
  afterAll(async () => {
    await t.close();
  });

  it('put() then get() returns the same bytes, and delete() removes them', async () => {
    const key = `tests/${randomBytes(6).toString('hex')}.bin`;
    const bytes = Uint8Array.from({ length: 4096 }, (_, i) => (i * 37) % 256);
    await storage.put(key, bytes, 'application/octet-stream');
    expect(Buffer.compare(await storage.get(key), Buffer.from(bytes))).toBe(0);
    await storage.delete(key);
    await expect(storage.get(key)).rejects.toBeInstanceOf(NotFoundError);
  });

  it('ping() is true for the bucket created at start-up', async () => {
    expect(await storage.ping()).toBe(true);
  });
});
