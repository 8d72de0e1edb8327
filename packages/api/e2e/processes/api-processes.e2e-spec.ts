import { type ChildProcess, spawn } from 'node:child_process';
import http from 'node:http';
import { createServer } from 'node:net';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { workerEnv } from '../fits/worker';
import { bootTestApp, type TestApp } from '../setup';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

/** One request on a fresh connection, so node:cluster hands each to the next process. */
function getStatus(url: string): Promise<number> {
  return new Promise((resolve, reject) => {
    http
      .get(url, { agent: false, headers: { Connection: 'close' } }, (response) => {
        response.resume();
        response.on('end', () => resolve(response.statusCode ?? 0));
      })
      .on('error', reject);
  });
}

const alive = (pid: number): boolean => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

const until = async (what: string, test: () => boolean, ms = 20_000): Promise<void> => {
  const deadline = Date.now() + ms;
  while (!test()) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
};

describe('node dist/main.js with LIMBUS_API_PROCESSES=2', () => {
  let t: TestApp;
  let primary: ChildProcess;
  let output = '';
  let base = '';

  // The pids that logged a completed request, in order of first appearance.
  const servingPids = (): number[] => [
    ...new Set(
      output
        .split('\n')
        .filter((line) => line.includes('"msg":"request completed"'))
        .map((line) => Number(/"pid":(\d+)/.exec(line)?.[1])),
    ),
  ];

  beforeAll(async () => {
    t = await bootTestApp(); // applies the migrations to the test database
    const port = await freePort();
    base = `http://127.0.0.1:${port}`;
    primary = spawn(process.execPath, [path.resolve(__dirname, '../../dist/main.js')], {
      env: workerEnv(t, {
        LIMBUS_API_PROCESSES: '2',
        LIMBUS_PORT: String(port),
        LIMBUS_PUBLIC_URL: base,
        LOG_LEVEL: 'info',
      }),
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    primary.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    primary.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    await until('the ready line', () => output.includes(`ready api http://127.0.0.1:${port}`), 60_000);
  });
  afterAll(async () => {
    if (primary.exitCode === null) primary.kill('SIGKILL');
    await t.close();
  });

  it('prints the ready line once, after both processes listen, and both answer', async () => {
    expect(output.match(/^ready api /gm)).toHaveLength(1);
    for (let i = 0; i < 8; i += 1) expect(await getStatus(`${base}/api/health`)).toBe(200);
    await until('log lines of both processes', () => servingPids().length === 2, 5_000);
    expect(servingPids()).not.toContain(primary.pid);
  });

  it('replaces a process that dies and keeps answering', async () => {
    const [victim] = servingPids();
    process.kill(victim ?? 0, 'SIGKILL');
    await until('the replacement', () => output.includes('starting another'));
    const before = servingPids().length;
    // Every request is answered while the replacement starts; once it listens, it takes its share.
    const deadline = Date.now() + 30_000;
    while (servingPids().length === before && Date.now() < deadline) {
      expect(await getStatus(`${base}/api/health`)).toBe(200);
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    expect(servingPids()).toHaveLength(before + 1);
  });

  it('stops every process on SIGTERM and exits 0', async () => {
    const pids = servingPids();
    const exited = new Promise<number | null>((resolve) => primary.once('exit', resolve));
    primary.kill('SIGTERM');
    expect(await exited).toBe(0);
    await until('the processes gone', () => pids.every((pid) => !alive(pid)), 10_000);
  });
});
