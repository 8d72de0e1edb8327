import { resolve } from 'node:path';
import { z } from 'zod';
import { closeOnSignals, fakePort, readFakeEnv } from './fake-env';
import { startObjectStore } from './object-store-server';

async function main(): Promise<void> {
  const env = readFakeEnv({
    S3_PORT: fakePort(4569),
    S3_DIR: z.string().min(1),
    S3_BUCKET: z.string().min(3).default('limbus'),
  });
  const store = await startObjectStore({
    port: env.S3_PORT,
    directory: resolve(env.S3_DIR),
    bucket: env.S3_BUCKET,
  });
  closeOnSignals(store.close);
  console.log(`ready object-store ${store.endpoint}/${env.S3_BUCKET}`);
}

main().catch((error: unknown) => {
  console.error(`object-store: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
