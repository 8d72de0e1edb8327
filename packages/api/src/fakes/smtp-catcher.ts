import { z } from 'zod';
import { closeOnSignals, fakePort, readFakeEnv } from './fake-env';
import { startSmtpCatcher } from './smtp-catcher-server';

async function main(): Promise<void> {
  const env = readFakeEnv({
    SMTP_PORT: fakePort(2525),
    CATCHER_HTTP_PORT: fakePort(2526),
    CATCHER_DIR: z.string().min(1).optional(),
  });
  const catcher = await startSmtpCatcher({
    smtpPort: env.SMTP_PORT,
    httpPort: env.CATCHER_HTTP_PORT,
    dir: env.CATCHER_DIR,
  });
  closeOnSignals(catcher.close);
  console.log(`ready smtp-catcher ${catcher.smtpUrl} ${catcher.httpUrl}`);
}

main().catch((error: unknown) => {
  console.error(`smtp-catcher: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
