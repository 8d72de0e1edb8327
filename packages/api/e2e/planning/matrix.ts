// The planning rows of docs/authorization.md ("Authorization (planning)") as data: the doc's table and this
// file must say the same thing. Each cell is the status an actor gets; `ok` stands for the route's own
// success code; "own" rows answer `ok` with the caller's own stations (checked apart).
import type { Cell, MatrixRow } from '../authorization/matrix';
import type { Actor } from '../events/workspace';

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

export const PLANNING_MATRIX: MatrixRow[] = [
  { route: 'PATCH /api/events/:eventId with prediction', ok: 200, cells: only(['admin', 'coordinator']) },
  { route: 'GET /api/events/:eventId/prediction', ok: 200, cells: members('ok') },
  {
    route: 'POST /api/events/:eventId/prediction/offset-from-fit',
    ok: 200,
    cells: only(['admin', 'coordinator']),
  },
  { route: 'GET /api/events/:eventId/prediction/map', ok: 200, cells: members('ok') },
  { route: 'GET /api/events/:eventId/prediction.geojson', ok: 200, cells: members('ok') },
  { route: 'GET /api/events/:eventId/prediction.kml', ok: 200, cells: members('ok') },
  { route: 'GET /api/events/:eventId/prediction/figure', ok: 200, cells: members('ok') },
  { route: 'GET /api/events/:eventId/placement', ok: 200, cells: only(['admin', 'coordinator']) },
  // The proposer becomes the station's observer: a member with the observer role; an admin outside the
  // team is not one.
  { route: 'POST /api/events/:eventId/site-proposals', ok: 201, cells: only(['observer']) },
  {
    route: 'POST /api/events/:eventId/site-proposals/:stationId/accept',
    ok: 200,
    cells: only(['admin', 'coordinator']),
  },
  {
    route: 'POST /api/events/:eventId/site-proposals/:stationId/decline',
    ok: 204,
    cells: only(['admin', 'coordinator']),
  },
  { route: 'POST /api/events/:eventId/briefings', ok: 200, cells: only(['admin', 'coordinator']) },
  { route: 'GET /api/events/:eventId/briefing', ok: 200, cells: members('ok') },
];
