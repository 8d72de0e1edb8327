// The HTTP side of ./tools/fault-test: signs in, imports the example event, submits fits, waits for
// them and probes the API while a service is down. Plain fetch against the private stack; the state
// (URL, token, event id) lives in a JSON file between calls.
//
//   node fault-client.mjs setup   STATE BASE_URL
//   node fault-client.mjs submit  STATE COUNT IDS_FILE        appends the new fit ids, one a line
//   node fault-client.mjs running STATE IDS_FILE SECONDS      until one of them is running
//   node fault-client.mjs solved  STATE IDS_FILE SECONDS      until all are solved (1 if one fails)
//   node fault-client.mjs probe   STATE SECONDS               GETs and a submit, counting the statuses
import { appendFileSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const EXAMPLE = path.resolve(import.meta.dirname, '../../docs/examples/event-example.json');
const [command, stateFile, ...args] = process.argv.slice(2);

const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

async function call(state, method, url, body) {
  const headers = state.token ? { Authorization: `Bearer ${state.token}` } : {};
  let payload;
  if (body instanceof FormData) payload = body;
  else if (body !== undefined) {
    headers['Content-Type'] = 'application/json';
    payload = JSON.stringify(body);
  }
  const response = await fetch(`${state.base}${url}`, {
    method,
    headers,
    body: payload,
    signal: AbortSignal.timeout(30_000),
  });
  const text = await response.text();
  return { status: response.status, body: text ? JSON.parse(text) : null };
}

async function ok(state, method, url, body) {
  const { status, body: answer } = await call(state, method, url, body);
  if (status >= 300) throw new Error(`${method} ${url}: ${status} ${JSON.stringify(answer).slice(0, 300)}`);
  return answer;
}

const readIds = (file) => readFileSync(file, 'utf8').split('\n').filter(Boolean);

async function setup(base) {
  const state = { base: base.replace(/\/+$/, ''), token: null };
  const login = await ok(state, 'POST', '/api/auth/login', {
    email: 'coordinator@example.org',
    password: 'limbus-demo',
  });
  state.token = login.accessToken;
  const [team] = await ok(state, 'GET', '/api/teams');
  const file = JSON.parse(readFileSync(EXAMPLE, 'utf8'));
  file.title = `Fault test ${new Date().toISOString()}`;
  const form = new FormData();
  form.set('teamId', team.id);
  form.set('bodyName', 'Fault-test body');
  form.set('file', new Blob([JSON.stringify(file)], { type: 'application/json' }), 'event.json');
  state.eventId = (await ok(state, 'POST', '/api/events/import', form)).id;
  writeFileSync(stateFile, JSON.stringify(state));
  console.log(`event ${state.eventId}`);
}

async function submit(state, count, idsFile) {
  const ids = await Promise.all(
    Array.from({ length: count }, () =>
      ok(state, 'POST', `/api/events/${state.eventId}/fits`, { options: {} }).then((fit) => fit.id),
    ),
  );
  appendFileSync(idsFile, ids.map((id) => `${id}\n`).join(''));
  console.log(`submitted ${ids.length} fits`);
}

/** Each fit's state; a fit the API could not answer for (e.g. 503) counts as 'unanswered'. */
async function states(state, ids) {
  return Promise.all(
    ids.map((id) =>
      call(state, 'GET', `/api/fits/${id}`).then(
        (r) => (r.status === 200 ? r.body.state : 'unanswered'),
        () => 'unanswered',
      ),
    ),
  );
}

function tally(list) {
  const counts = {};
  for (const s of list) counts[s] = (counts[s] ?? 0) + 1;
  return Object.entries(counts)
    .map(([s, n]) => `${n} ${s}`)
    .join(', ');
}

async function untilRunning(state, idsFile, seconds) {
  const ids = readIds(idsFile);
  const deadline = Date.now() + seconds * 1000;
  while (Date.now() < deadline) {
    const now = await states(state, ids);
    if (now.includes('running')) {
      console.log(`running: ${tally(now)}`);
      return 0;
    }
    await sleep(100);
  }
  console.error(`no fit was running within ${seconds} s`);
  return 1;
}

async function untilSolved(state, idsFile, seconds) {
  const ids = readIds(idsFile);
  const started = Date.now();
  let now = [];
  while (Date.now() - started < seconds * 1000) {
    now = await states(state, ids);
    if (now.includes('failed')) break;
    if (now.every((s) => s === 'solved')) {
      console.log(`all ${ids.length} solved (waited ${((Date.now() - started) / 1000).toFixed(1)} s)`);
      return 0;
    }
    await sleep(250);
  }
  console.error(`not all solved after ${((Date.now() - started) / 1000).toFixed(1)} s: ${tally(now)}`);
  return 1;
}

/** While a service is down: what the API answers, and how fast. */
async function probe(state, seconds) {
  const routes = [
    ['GET', '/api/me'],
    ['GET', `/api/events/${state.eventId}`],
    ['POST', `/api/events/${state.eventId}/fits`],
  ];
  const counts = {};
  let slowestMs = 0;
  const deadline = Date.now() + seconds * 1000;
  while (Date.now() < deadline) {
    for (const [method, url] of routes) {
      const started = Date.now();
      let status;
      try {
        status = (await call(state, method, url, method === 'POST' ? { options: {} } : undefined)).status;
      } catch (error) {
        status = `no answer (${error instanceof Error ? error.name : String(error)})`;
      }
      slowestMs = Math.max(slowestMs, Date.now() - started);
      const key = `${method} ${url.replace(state.eventId, ':id')} ${status}`;
      counts[key] = (counts[key] ?? 0) + 1;
    }
    await sleep(200);
  }
  for (const [key, n] of Object.entries(counts)) console.log(`  ${key}: ${n}`);
  console.log(`  slowest answer ${slowestMs} ms`);
  const wrong = Object.keys(counts).filter((key) => !key.endsWith(' 503'));
  if (wrong.length > 0) {
    console.error(`expected 503 only, also got: ${wrong.join('; ')}`);
    return 1;
  }
  return 0;
}

async function main() {
  if (command === 'setup') return setup(args[0]).then(() => 0);
  const state = JSON.parse(readFileSync(stateFile, 'utf8'));
  switch (command) {
    case 'submit':
      return submit(state, Number(args[0]), args[1]).then(() => 0);
    case 'running':
      return untilRunning(state, args[0], Number(args[1]));
    case 'solved':
      return untilSolved(state, args[0], Number(args[1]));
    case 'probe':
      return probe(state, Number(args[0]));
    default:
      throw new Error(`unknown command ${command}`);
  }
}

main().then(
  (code) => process.exit(code),
  (error) => {
    console.error(`fault-client ${command}: ${error instanceof Error ? error.message : String(error)}`);
    process.exit(1);
  },
);
