// API benchmark against a running stack on loopback (./tools/start, or any API + worker):
//   LIMBUS_BENCH_URL=http://127.0.0.1:8080 pnpm --filter @limbus/api bench
// Signs in as LIMBUS_BENCH_EMAIL / LIMBUS_BENCH_PASSWORD (default: the demo coordinator), imports a
// 10-chord event into that user's team, and measures
//   1. submit-to-solved latency of one fit at a time (target p50 ≤ 500 ms),
//   2. 50 fits submitted at once: all solved, none lost, total time,
//   3. GET /api/events/:id and GET /api/me throughput with autocannon, 10 connections for
//      LIMBUS_BENCH_READ_SECONDS (default 10 s) each (target ≥ 500 req/s, p99 ≤ 50 ms each), with the
//      machine's 1-minute load average before and after, since other work on the machine moves them.
// LIMBUS_BENCH_ONLY=reads skips 1 and 2. Prints the figures; docs/performance.md ("API") records runs.
import { readFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';

const BASE = (process.env.LIMBUS_BENCH_URL ?? 'http://127.0.0.1:8080').replace(/\/+$/, '');
const EMAIL = process.env.LIMBUS_BENCH_EMAIL ?? 'coordinator@example.org';
const PASSWORD = process.env.LIMBUS_BENCH_PASSWORD ?? 'limbus-demo';
const SEQUENTIAL_FITS = Number(process.env.LIMBUS_BENCH_FITS ?? 20);
const BURST_FITS = 50;
const READ_SECONDS = Number(process.env.LIMBUS_BENCH_READ_SECONDS ?? 10);
const READS_ONLY = process.env.LIMBUS_BENCH_ONLY === 'reads';
const EXAMPLE = path.resolve(__dirname, '../../../../docs/examples/event-example.json');

async function call<T>(method: string, url: string, token: string | null, body?: unknown): Promise<T> {
  const headers: Record<string, string> = token ? { Authorization: `Bearer ${token}` } : {};
  let payload: string | FormData | undefined;
  if (body instanceof FormData) payload = body;
  else if (body !== undefined) {
    headers['Content-Type'] = 'application/json';
    payload = JSON.stringify(body);
  }
  const response = await fetch(`${BASE}${url}`, { method, headers, body: payload });
  const text = await response.text();
  if (!response.ok) throw new Error(`${method} ${url}: ${response.status} ${text.slice(0, 300)}`);
  return (text ? JSON.parse(text) : null) as T;
}

function percentile(sorted: number[], p: number): number {
  const index = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[index] ?? NaN;
}

async function waitSolved(token: string, fitId: string, deadlineMs: number): Promise<string> {
  for (;;) {
    const fit = await call<{ state: string }>('GET', `/api/fits/${fitId}`, token);
    if (fit.state === 'solved' || fit.state === 'failed') return fit.state;
    if (Date.now() > deadlineMs) return 'timeout';
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

async function main(): Promise<void> {
  const { accessToken: token } = await call<{ accessToken: string }>('POST', '/api/auth/login', null, {
    email: EMAIL,
    password: PASSWORD,
  });
  const teams = await call<Array<{ id: string }>>('GET', '/api/teams', token);
  const teamId = teams[0]?.id;
  if (!teamId) throw new Error(`${EMAIL} belongs to no team`);
  const file = JSON.parse(readFileSync(EXAMPLE, 'utf8')) as { title: string; chords: unknown[] };
  file.title = `Bench event ${new Date().toISOString()}`;
  file.chords = file.chords.slice(0, 10);
  const form = new FormData();
  form.set('teamId', teamId);
  // A body of its own: the demo team may hold several by now, and then an event must name its body.
  form.set('bodyName', 'Benchmark body');
  form.set('file', new Blob([JSON.stringify(file)], { type: 'application/json' }), 'event.json');
  const { id: eventId } = await call<{ id: string }>('POST', '/api/events/import', token, form);
  console.log(`api bench against ${BASE}: event ${eventId} (10 chords)`);
  if (!READS_ONLY) await fits(token, eventId);
  // The event's first read builds its detail view; the measured reads are then served from the cache.
  await call('GET', `/api/events/${eventId}`, token);
  await reads(token, `/api/events/${eventId}`, 'GET /api/events/:id');
  await reads(token, '/api/me', 'GET /api/me');
}

async function fits(token: string, eventId: string): Promise<void> {
  // Warm-up: the first solve loads the geometry code in the worker.
  const warm = await call<{ id: string }>('POST', `/api/events/${eventId}/fits`, token, { options: {} });
  await waitSolved(token, warm.id, Date.now() + 60_000);

  const latencies: number[] = [];
  for (let i = 0; i < SEQUENTIAL_FITS; i++) {
    const started = performance.now();
    const { id } = await call<{ id: string }>('POST', `/api/events/${eventId}/fits`, token, { options: {} });
    const state = await waitSolved(token, id, Date.now() + 60_000);
    if (state !== 'solved') throw new Error(`fit ${id} ended ${state}`);
    latencies.push(performance.now() - started);
  }
  latencies.sort((a, b) => a - b);
  console.log(
    `submit-to-solved, ${SEQUENTIAL_FITS} fits one at a time: p50 ${percentile(latencies, 50).toFixed(0)} ms, ` +
      `p95 ${percentile(latencies, 95).toFixed(0)} ms, max ${percentile(latencies, 100).toFixed(0)} ms (target p50 ≤ 500 ms)`,
  );

  const burstStarted = performance.now();
  const ids = await Promise.all(
    Array.from({ length: BURST_FITS }, () =>
      call<{ id: string }>('POST', `/api/events/${eventId}/fits`, token, { options: {} }).then((r) => r.id),
    ),
  );
  const submittedMs = performance.now() - burstStarted;
  const states = await Promise.all(ids.map((id) => waitSolved(token, id, Date.now() + 300_000)));
  const totalMs = performance.now() - burstStarted;
  const solved = states.filter((s) => s === 'solved').length;
  console.log(
    `${BURST_FITS} fits at once: ${solved} solved, ${BURST_FITS - solved} not solved, distinct ids ${new Set(ids).size}; ` +
      `all submitted in ${submittedMs.toFixed(0)} ms, all finished in ${(totalMs / 1000).toFixed(2)} s`,
  );
}

const loadNow = () => (loadavg()[0] ?? NaN).toFixed(2);

async function reads(token: string, url: string, label: string): Promise<void> {
  const loadBefore = loadNow();
  const result = await autocannon({
    url: `${BASE}${url}`,
    connections: 10,
    duration: READ_SECONDS,
    headers: { Authorization: `Bearer ${token}` },
  });
  const met = result.requests.average >= 500 && result.latency.p99 <= 50 ? 'met' : 'NOT met';
  console.log(
    `${label}, 10 connections, ${READ_SECONDS} s: ${result.requests.average.toFixed(0)} req/s, ` +
      `latency p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms, non-2xx ${result.non2xx}, ` +
      `errors ${result.errors}; load average ${loadBefore} before, ${loadNow()} after ` +
      `(target ≥ 500 req/s, p99 ≤ 50 ms: ${met})`,
  );
}

main().catch((error: unknown) => {
  console.error(`bench: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
