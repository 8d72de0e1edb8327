// The events list: which events make up the asked-for page (filtered, sorted and paged in SQL), and the
// summaries of that page. Plain SQL: the filters reach into fit runs and bodies, and a list read must
// cost the same whatever the size of the events behind it.
import type { EntityManager } from '@mikro-orm/mariadb';
import {
  FIT_STATE_VALUES,
  REVIEW_STATE_VALUES,
  type EventsQuery,
  type EventSummary,
  type FitStatus,
} from '@limbus/schema';

export interface ListScope {
  userId: string;
  teamIds: string[];
  /** Teams where the caller may review (reviewer role, or site admin). */
  reviewerTeamIds: string[];
  query: EventsQuery;
}

const ORDER: Record<EventsQuery['sort'], string> = {
  'date-desc': 'e.`event_time_utc` desc, e.`id` asc',
  'date-asc': 'e.`event_time_utc` asc, e.`id` asc',
  title: 'e.`title` asc, e.`id` asc',
  'created-desc': 'e.`created_at` desc, e.`id` asc',
};

/** LIKE pattern matching the text anywhere, with the text's own % _ \ taken literally. */
function containing(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

const marks = (n: number) => Array.from({ length: n }, () => '?').join(', ');

/**
 * "In review" and "approved" ask whether any fit of the event is so (an older fit may be in review while
 * a newer one runs); the other filters ask about the latest fit.
 */
function fitCondition(filter: NonNullable<EventsQuery['fit']>): string {
  const any = (state: string) =>
    `exists (select 1 from \`fit_runs\` f where f.\`event_id\` = e.\`id\` and f.\`review_state\` = '${state}')`;
  switch (filter) {
    case 'none':
      return 'lf.`id` is null';
    case 'running':
      return "lf.`state` in ('queued', 'running')";
    case 'failed':
      return "lf.`state` = 'failed'";
    case 'solved':
      return "lf.`state` = 'solved' and lf.`review_state` = 'none'";
    case 'returned':
      return "lf.`review_state` = 'returned'";
    case 'in_review':
      return any('in_review');
    case 'approved':
      return any('approved');
  }
}

export async function listEventIds(
  em: EntityManager,
  scope: ListScope,
): Promise<{ ids: string[]; total: number }> {
  const { query } = scope;
  const where: string[] = [`e.\`team_id\` in (${marks(scope.teamIds.length)})`, 'e.`state` = ?'];
  const params: unknown[] = [...scope.teamIds, query.archived ? 'deleted' : 'active'];
  if (query.bodyId !== undefined) {
    where.push('e.`body_id` = ?');
    params.push(query.bodyId);
  }
  if (query.q !== undefined && query.q !== '') {
    const pattern = containing(query.q);
    where.push('(e.`title` like ? or b.`name` like ? or b.`designation` like ?)');
    params.push(pattern, pattern, pattern);
  }
  if (query.fit !== undefined) where.push(fitCondition(query.fit));
  if (query.awaitingMyReview) {
    if (scope.reviewerTeamIds.length === 0) return { ids: [], total: 0 };
    where.push(`e.\`team_id\` in (${marks(scope.reviewerTeamIds.length)})`);
    params.push(...scope.reviewerTeamIds);
    where.push(
      "exists (select 1 from `fit_runs` f where f.`event_id` = e.`id` and f.`review_state` = 'in_review' and f.`created_by_id` <> ?)",
    );
    params.push(scope.userId);
  }
  const from =
    'from `events` e join `bodies` b on b.`id` = e.`body_id` ' +
    'left join `fit_runs` lf on lf.`id` = (select f.`id` from `fit_runs` f where f.`event_id` = e.`id` ' +
    'order by f.`created_at` desc, f.`id` desc limit 1) ' +
    `where ${where.join(' and ')}`;
  const connection = em.getConnection();
  const [counted] = await connection.execute<Array<{ n: number | string | bigint }>>(
    `select count(*) as n ${from}`,
    params,
  );
  const total = Number(counted?.n ?? 0);
  const offset = (query.page - 1) * query.pageSize;
  if (offset >= total) return { ids: [], total };
  const rows = await connection.execute<Array<{ id: string }>>(
    `select e.\`id\` ${from} order by ${ORDER[query.sort]} limit ? offset ?`,
    [...params, query.pageSize, offset],
  );
  return { ids: rows.map((r) => r.id), total };
}

interface EventRow {
  id: string;
  title: string;
  team_id: string;
  body_id: string;
  body_name: string;
  event_time_utc: string;
  deleted_at: Date | string | null;
  star: string | { raDeg: number; decDeg: number };
  revision: number;
}

interface FitRow {
  id: string;
  event_id: string;
  state: string;
  review_state: string;
  created_at: Date | string;
  data_sha256: string;
}

const toIso = (value: Date | string) => (value instanceof Date ? value : new Date(value)).toISOString();

function oneOf<T extends string>(values: readonly T[], value: string): T {
  const found = values.find((v) => v === value);
  if (found === undefined) throw new Error(`unexpected stored value "${value}"`);
  return found;
}

/** Summaries of the given events, in the given order. `dataSha256At` gives an event's current data hash. */
export async function summariesOf(
  em: EntityManager,
  ids: string[],
  userId: string,
  dataSha256At: (eventId: string, revision: number) => Promise<string>,
): Promise<EventSummary[]> {
  const connection = em.getConnection();
  const inIds = `(${marks(ids.length)})`;
  const countBy = async (table: string, extra = '', extraParams: unknown[] = []) => {
    const rows = await connection.execute<Array<{ event_id: string; n: number | string | bigint }>>(
      `select \`event_id\`, count(*) as n from \`${table}\` where \`event_id\` in ${inIds}${extra} group by \`event_id\``,
      [...ids, ...extraParams],
    );
    return new Map(rows.map((r) => [r.event_id, Number(r.n)]));
  };
  const [events, stations, chords, reports, fits, myStations, openReports, inReview, fitRows] =
    await Promise.all([
      connection.execute<EventRow[]>(
        'select e.`id`, e.`title`, e.`team_id`, e.`body_id`, b.`name` as body_name, e.`event_time_utc`, ' +
          'e.`deleted_at`, e.`star`, e.`revision` from `events` e join `bodies` b on b.`id` = e.`body_id` ' +
          `where e.\`id\` in ${inIds}`,
        ids,
      ),
      countBy('stations'),
      countBy('chords'),
      countBy('reports'),
      countBy('fit_runs'),
      countBy('stations', ' and `observer_id` = ?', [userId]),
      countBy('reports', " and `state` = 'submitted'"),
      countBy('fit_runs', " and `review_state` = 'in_review'"),
      connection.execute<FitRow[]>(
        'select `id`, `event_id`, `state`, `review_state`, `created_at`, `data_sha256` from `fit_runs` ' +
          `where \`event_id\` in ${inIds} order by \`created_at\` desc, \`id\` desc`,
        ids,
      ),
    ]);
  const latest = new Map<string, FitRow>();
  for (const f of fitRows) if (!latest.has(f.event_id)) latest.set(f.event_id, f);
  const byId = new Map(events.map((e) => [e.id, e]));
  const summaries: EventSummary[] = [];
  for (const id of ids) {
    const e = byId.get(id);
    if (e === undefined) continue;
    const star = typeof e.star === 'string' ? (JSON.parse(e.star) as EventRow['star']) : e.star;
    if (typeof star === 'string') throw new Error(`event ${id} has an unreadable star`);
    const f = latest.get(id);
    let latestFit: FitStatus | null = null;
    if (f !== undefined)
      latestFit = {
        id: f.id,
        state: oneOf(FIT_STATE_VALUES, f.state),
        reviewState: oneOf(REVIEW_STATE_VALUES, f.review_state),
        createdAt: toIso(f.created_at),
        inputMatchesEvent: f.data_sha256 === (await dataSha256At(id, e.revision)),
      };
    summaries.push({
      id,
      title: e.title,
      teamId: e.team_id,
      bodyId: e.body_id,
      bodyName: e.body_name,
      eventTimeUtc: e.event_time_utc,
      deletedAt: e.deleted_at === null ? null : toIso(e.deleted_at),
      star: { raDeg: star.raDeg, decDeg: star.decDeg },
      counts: {
        stations: stations.get(id) ?? 0,
        chords: chords.get(id) ?? 0,
        reports: reports.get(id) ?? 0,
        fits: fits.get(id) ?? 0,
        myStations: myStations.get(id) ?? 0,
        openReports: openReports.get(id) ?? 0,
      },
      latestFit,
      fitsInReview: inReview.get(id) ?? 0,
    });
  }
  return summaries;
}
