// The event-workspace rows of docs/authorization.md as data: the doc's table and this file must say
// the same thing. Each cell is the status an actor gets; `ok` stands for the route's own success code.
import type { Actor } from '../events/workspace';

export type Cell = 'ok' | 401 | 403 | 404;

export interface MatrixRow {
  route: string;
  ok: number;
  cells: Record<Actor, Cell>;
}

const members = (ok: Exclude<Cell, 401 | 404>, overrides: Partial<Record<Actor, Cell>> = {}) =>
  ({
    admin: ok,
    coordinator: ok,
    observer: ok,
    modeller: ok,
    reviewer: ok,
    outsider: 404,
    anonymous: 401,
    ...overrides,
  }) satisfies Record<Actor, Cell>;

const only = (allowed: Actor[]) =>
  members(403, Object.fromEntries(allowed.map((a) => [a, 'ok' as const])) as Partial<Record<Actor, Cell>>);

export const MATRIX: MatrixRow[] = [
  { route: 'GET /api/events', ok: 200, cells: members('ok', { outsider: 'ok' }) },
  { route: 'POST /api/events', ok: 201, cells: only(['admin', 'coordinator']) },
  { route: 'POST /api/events/import', ok: 201, cells: only(['admin', 'coordinator']) },
  { route: 'GET /api/events/:eventId', ok: 200, cells: members('ok') },
  { route: 'PATCH /api/events/:eventId', ok: 200, cells: only(['admin', 'coordinator', 'modeller']) },
  { route: 'DELETE /api/events/:eventId', ok: 204, cells: only(['admin', 'coordinator']) },
  { route: 'POST /api/events/:eventId/restore', ok: 200, cells: only(['admin', 'coordinator']) },
  { route: 'GET /api/events/:eventId/export', ok: 200, cells: members('ok') },
  { route: 'GET /api/events/:eventId/audit', ok: 200, cells: only(['admin', 'coordinator']) },
  { route: 'GET /api/events/:eventId/reviews', ok: 200, cells: members('ok') },
  {
    // Lists show the caller's own teams only: a site admin or another team's member gets an empty page.
    route: 'GET /api/events?archived=true&teamId=:teamId',
    ok: 200,
    cells: members('ok', { observer: 403, modeller: 403, reviewer: 403, outsider: 'ok' }),
  },
  { route: 'POST /api/events/:eventId/stations', ok: 201, cells: only(['admin', 'coordinator']) },
  { route: 'PATCH /api/events/:eventId/stations/:stationId', ok: 200, cells: only(['admin', 'coordinator']) },
  {
    route: 'DELETE /api/events/:eventId/stations/:stationId',
    ok: 204,
    cells: only(['admin', 'coordinator']),
  },
  { route: 'GET /api/events/:eventId/reports', ok: 200, cells: members('ok') },
  // Only the observer the station names; an admin is not that observer.
  { route: 'POST /api/events/:eventId/reports', ok: 201, cells: only(['observer']) },
  { route: 'PATCH /api/reports/:reportId', ok: 200, cells: only(['observer']) },
  { route: 'POST /api/reports/:reportId/accept', ok: 200, cells: only(['admin', 'coordinator']) },
  { route: 'POST /api/reports/:reportId/reject', ok: 200, cells: only(['admin', 'coordinator']) },
  // The report's author (here the observer) and nobody else; an admin is not the author.
  { route: 'POST /api/reports/:reportId/corrections', ok: 201, cells: only(['observer']) },
  {
    route: 'POST /api/reports/:reportId/corrections/:correctionId/accept',
    ok: 200,
    cells: only(['admin', 'coordinator']),
  },
  {
    route: 'POST /api/reports/:reportId/corrections/:correctionId/reject',
    ok: 200,
    cells: only(['admin', 'coordinator']),
  },
  {
    route: 'POST /api/reports/:reportId/light-curve',
    ok: 201,
    cells: only(['admin', 'coordinator', 'observer']),
  },
  { route: 'GET /api/reports/:reportId/light-curve', ok: 200, cells: members('ok') },
  { route: 'GET /api/events/:eventId/chords', ok: 200, cells: members('ok') },
  { route: 'POST /api/events/:eventId/chords', ok: 201, cells: only(['admin', 'coordinator', 'modeller']) },
  {
    route: 'POST /api/events/:eventId/chords/import',
    ok: 201,
    cells: only(['admin', 'coordinator', 'modeller']),
  },
  { route: 'PATCH /api/chords/:chordId', ok: 200, cells: only(['admin', 'coordinator', 'modeller']) },
  { route: 'DELETE /api/chords/:chordId', ok: 204, cells: only(['admin', 'coordinator', 'modeller']) },
  { route: 'POST /api/events/:eventId/fits', ok: 202, cells: only(['admin', 'coordinator', 'modeller']) },
  { route: 'GET /api/events/:eventId/fits', ok: 200, cells: members('ok') },
  { route: 'GET /api/fits/:fitId', ok: 200, cells: members('ok') },
  { route: 'POST /api/fits/:fitId/stream-ticket', ok: 201, cells: members('ok') },
  // The fit's author (here the modeller who submitted it) and nobody else.
  { route: 'POST /api/fits/:fitId/review-request', ok: 200, cells: only(['modeller']) },
  // Reviewers (and admins) other than the author.
  { route: 'POST /api/fits/:fitId/reviews', ok: 201, cells: only(['admin', 'reviewer']) },
  { route: 'GET /api/fits/:fitId/reviews', ok: 200, cells: members('ok') },
];
