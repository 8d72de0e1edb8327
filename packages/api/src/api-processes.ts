import cluster, { type Worker } from 'node:cluster';

/** A process that keeps dying is a configuration problem, not bad luck: give up instead of spinning. */
const MAX_RESTARTS_PER_MINUTE = 5;
// Under the 10 s that tools/lib/services.sh waits before it SIGKILLs this process itself.
const STOP_GRACE_MS = 8_000;

/**
 * The primary of `node dist/main.js` when more than one HTTP process is asked for: forks `count`
 * copies of this entry, which share the port through node:cluster, prints `readyLine` once all of them
 * listen, replaces one that dies, and stops them all on SIGTERM or SIGINT. A copy that fails before
 * it first listens (bad environment, database down) stops the whole start with its exit code.
 */
export function superviseApiProcesses(count: number, env: NodeJS.ProcessEnv, readyLine: string): void {
  let ready = false;
  let stopping = false;
  let stopCode = 0;
  let restarts: number[] = [];
  const listening = new Set<number>();

  const fork = (): Worker => cluster.fork(env);

  cluster.on('listening', (worker) => {
    listening.add(worker.id);
    if (!ready && listening.size === count) {
      ready = true;
      console.log(readyLine);
    }
  });

  cluster.on('exit', (worker, code, signal) => {
    listening.delete(worker.id);
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(stopCode);
      return;
    }
    if (!ready) {
      console.error(`api process ${worker.process.pid} exited during start (${signal ?? code})`);
      stopAll(typeof code === 'number' && code !== 0 ? code : 1);
      return;
    }
    const now = Date.now();
    restarts = [...restarts.filter((t) => now - t < 60_000), now];
    if (restarts.length > MAX_RESTARTS_PER_MINUTE) {
      console.error(`api processes died ${restarts.length} times within a minute; stopping`);
      stopAll(1);
      return;
    }
    console.error(`api process ${worker.process.pid} exited (${signal ?? code}); starting another`);
    fork();
  });

  function stopAll(exitCode: number): void {
    if (stopping) return;
    stopping = true;
    stopCode = exitCode;
    const workers = Object.values(cluster.workers ?? {}).filter((w): w is Worker => w !== undefined);
    if (workers.length === 0) process.exit(exitCode);
    for (const worker of workers) worker.process.kill('SIGTERM');
    setTimeout(() => {
      for (const worker of workers) if (!worker.isDead()) worker.process.kill('SIGKILL');
      process.exit(exitCode);
    }, STOP_GRACE_MS).unref();
  }

  process.on('SIGTERM', () => stopAll(0));
  process.on('SIGINT', () => stopAll(0));
  for (let i = 0; i < count; i += 1) fork();
}
