import { mkdir } from 'node:fs/promises';
import S3rver from 's3rver';

export interface ObjectStoreOptions {
  /** 0 picks a free port (tests). */
  port: number;
  directory: string;
  bucket: string;
  host?: string;
}

export interface ObjectStore {
  endpoint: string;
  close(): Promise<void>;
}

/**
 * A local S3-compatible store for the demo and tests (uploads, exports); it accepts the fixed
 * credentials S3RVER/S3RVER and keeps objects as files under `directory`.
 */
export async function startObjectStore(options: ObjectStoreOptions): Promise<ObjectStore> {
  const host = options.host ?? '127.0.0.1';
  await mkdir(options.directory, { recursive: true });
  const server = new S3rver({
    address: host,
    port: options.port,
    silent: true,
    directory: options.directory,
    // Path-style URLs only (S3_FORCE_PATH_STYLE=1): no wildcard DNS on loopback.
    vhostBuckets: false,
    configureBuckets: [{ name: options.bucket }],
  });
  const address = await server.run();
  return {
    endpoint: `http://${host}:${address.port}`,
    close: () => server.close(),
  };
}
