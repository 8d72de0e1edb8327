import type { EntityManager } from '@mikro-orm/mariadb';
import type { TimedMark } from '@limbus/geometry';
import type { CorrectionView, ReportView } from '@limbus/schema';
import { Chord } from '../chords/entities/chord.entity';
import { LightCurveTiming } from '../timings/entities/light-curve-timing.entity';
import type { Report } from './entities/report.entity';
import { ReportCorrection } from './entities/report-correction.entity';

export type { ReportView } from '@limbus/schema';

/** What a report view needs loaded on the report itself. */
export const REPORT_VIEW_POPULATE = ['station', 'author', 'event', 'event.team', 'lightCurve'] as const;

/** Loaded with `author` and `decidedBy`. */
export function correctionView(c: ReportCorrection): CorrectionView {
  return {
    id: c.id,
    reportId: c.report.id,
    author: { id: c.author.id, name: c.author.name },
    changes: c.changes,
    message: c.message,
    state: c.state,
    decidedBy: c.decidedBy ? { id: c.decidedBy.id, name: c.decidedBy.name } : null,
    reason: c.reason,
    createdAt: c.createdAt.toISOString(),
    decidedAt: c.decidedAt?.toISOString() ?? null,
  };
}

function timedMarkOf(value: unknown): TimedMark | null {
  const parsed: unknown = typeof value === 'string' ? JSON.parse(value) : value;
  if (
    typeof parsed === 'object' &&
    parsed !== null &&
    'time' in parsed &&
    typeof parsed.time === 'string' &&
    'sigmaSeconds' in parsed &&
    typeof parsed.sigmaSeconds === 'number'
  )
    return { time: parsed.time, sigmaSeconds: parsed.sigmaSeconds };
  return null;
}

/**
 * D and R of some timings, read out of their stored results in the database: a result also holds the
 * whole light curve and its model, which a report list has no use for.
 */
async function timedEdges(
  em: EntityManager,
  timingIds: string[],
): Promise<Map<string, { disappearance: TimedMark | null; reappearance: TimedMark | null }>> {
  if (timingIds.length === 0) return new Map();
  const rows = await em
    .getConnection()
    .execute<Array<{ id: string; d: unknown; r: unknown }>>(
      `select id, json_extract(result, '$.disappearance') as d, json_extract(result, '$.reappearance') as r from light_curve_timings where id in (${timingIds.map(() => '?').join(', ')})`,
      timingIds,
    );
  return new Map(
    rows.map((row) => [row.id, { disappearance: timedMarkOf(row.d), reappearance: timedMarkOf(row.r) }]),
  );
}

/**
 * Views of reports loaded with REPORT_VIEW_POPULATE, each with the chord it stands for, its newest
 * light-curve timing and its corrections (newest first); a few queries for the whole list.
 */
export async function reportViews(em: EntityManager, reports: Report[]): Promise<ReportView[]> {
  if (reports.length === 0) return [];
  const ids = reports.map((r) => r.id);
  const chords = await em.find(Chord, { report: { $in: ids } });
  const timings = await em.find(
    LightCurveTiming,
    { report: { $in: ids } },
    { orderBy: { createdAt: 'desc', id: 'asc' } },
  );
  const corrections = await em.find(
    ReportCorrection,
    { report: { $in: ids } },
    { populate: ['author', 'decidedBy'], orderBy: { createdAt: 'desc', id: 'asc' } },
  );
  const latest = new Map<string, LightCurveTiming>();
  for (const t of timings) if (!latest.has(t.report.id)) latest.set(t.report.id, t);
  const edges = await timedEdges(
    em,
    [...latest.values()].filter((t) => t.state === 'solved').map((t) => t.id),
  );
  return reports.map((r) => {
    const chord = chords.find((c) => c.report?.id === r.id) ?? null;
    const timing = latest.get(r.id) ?? null;
    const timed = timing ? edges.get(timing.id) : undefined;
    return {
      id: r.id,
      eventId: r.event.id,
      stationId: r.station.id,
      station: r.station.code,
      authorId: r.author.id,
      authorName: r.author.name,
      result: r.result,
      timesFromLightCurve: r.timesFromLightCurve,
      disappearance: r.disappearance,
      reappearance: r.reappearance,
      observedFromUtc: r.observedFromUtc,
      observedToUtc: r.observedToUtc,
      ringDips: r.ringDips,
      notes: r.notes,
      lightCurve: r.lightCurve
        ? {
            id: r.lightCurve.id,
            name: r.lightCurve.name,
            sizeBytes: r.lightCurve.sizeBytes,
            sha256: r.lightCurve.sha256,
          }
        : null,
      state: r.state,
      rejectReason: r.rejectReason,
      chord: chord
        ? {
            id: chord.id,
            source: chord.source,
            timingId: chord.timing?.id ?? null,
            disappearance: chord.disappearance,
            reappearance: chord.reappearance,
          }
        : null,
      latestTiming: timing
        ? {
            id: timing.id,
            state: timing.state,
            disappearance: timed?.disappearance ?? null,
            reappearance: timed?.reappearance ?? null,
            inChord: chord?.timing?.id === timing.id,
            finishedAt: timing.finishedAt?.toISOString() ?? null,
          }
        : null,
      corrections: corrections.filter((c) => c.report.id === r.id).map(correctionView),
      createdAt: r.createdAt.toISOString(),
      updatedAt: r.updatedAt.toISOString(),
    };
  });
}

export async function reportViewOf(em: EntityManager, report: Report): Promise<ReportView> {
  const [view] = await reportViews(em, [report]);
  if (!view) throw new Error(`no view of report ${report.id}`);
  return view;
}
