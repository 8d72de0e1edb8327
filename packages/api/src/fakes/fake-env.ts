import { z } from 'zod';

const port = z.coerce.number().int().min(0).max(65_535);

/**
 * Reads the fakes' settings from the environment; a bad value stops the process with a message
 * naming the variable, like the API's own start-up validation.
 */
export function readFakeEnv<T extends z.ZodRawShape>(
  shape: T,
  env: NodeJS.ProcessEnv = process.env,
): z.infer<z.ZodObject<T>> {
  const parsed = z.object(shape).safeParse(env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`invalid environment: ${problems.join('; ')}`);
  }
  return parsed.data;
}

export const fakePort = (fallback: number) => port.default(fallback);

/** Closes `close` on SIGINT/SIGTERM so start/test scripts can stop the fake cleanly. */
export function closeOnSignals(close: () => Promise<void>): void {
  const stop = (): void => {
    close().then(
      () => process.exit(0),
      (error: unknown) => {
        console.error(error);
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}
