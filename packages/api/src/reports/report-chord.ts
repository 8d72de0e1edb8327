// Step in the data flow: an accepted report (its typed times, or its light curve's timing) -> the chord
// and ring events the fit reads. Report accepts, timing accepts and report corrections all write through
// here, so they find the same chord and obey the same rule about better-timed values.
import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/mariadb';
import type { ChordInput } from '@limbus/geometry';
import { REPLACES_BETTER_TIMING } from '@limbus/schema';
import { betterTimingReplaced } from '../chords/better-timing';
import { nextChordPosition } from '../chords/chord-position';
import { Chord } from '../chords/entities/chord.entity';
import { RingEvent } from '../chords/entities/ring-event.entity';
import { ConflictError } from '../common/domain-errors';
import { applyChordInput, chordRow } from '../events/event-rows';
import { assertEventRoom } from '../events/event-size';
import type { LightCurveTiming } from '../timings/entities/light-curve-timing.entity';
import type { Report } from './entities/report.entity';

export interface ReportChordWrite {
  /** With its event and station loaded. */
  report: Report;
  /** The chord to write; null when the report stands for none (clouded out, technical failure). */
  input: ChordInput | null;
  /** The timing the times come from (source "timing"), or null for the report's own times. */
  timing: LightCurveTiming | null;
  /** For the message of a refusal: "the report" and "the report's typed times", say. */
  what: string;
  times: string;
  /** The person was told what would be replaced and agreed. */
  replaceTimedChord: boolean;
}

/** What the chord held before an accept rewrote or removed it, for the audit. */
export interface ChordBefore {
  chordId: string;
  source: Chord['source'];
  timingId: string | null;
  reportId: string | null;
  type: Chord['type'];
  disappearance: Chord['disappearance'];
  reappearance: Chord['reappearance'];
  start: string | null;
  end: string | null;
}

export interface ReportChordWritten {
  /** The chord now standing for the report; null when it stands for none. */
  chord: Chord | null;
  before: ChordBefore | null;
}

/**
 * Writes the chord a report stands for, inside the caller's transaction, and returns it. That chord is
 * the one linked to the report; failing that, the station's own chord (one observation, one chord: an
 * imported one, or another report's for the same station), preferring one of the same type; failing
 * that, a new one. The rows are read FOR UPDATE, so two accepts at one station see each other's result.
 * The chord keeps its clock offset, which a modeller may have set. With no chord to write, only a
 * chord linked to the report is removed.
 */
export async function writeReportChord(em: EntityManager, w: ReportChordWrite): Promise<ReportChordWritten> {
  const { report, input } = w;
  const lock = { lockMode: LockMode.PESSIMISTIC_WRITE, refresh: true } as const;
  const linked = await em.findOne(Chord, { report: report.id }, lock);
  let existing = linked;
  if (!existing && input) {
    const atStation = await em.find(
      Chord,
      { event: report.event.id, station: report.station.id },
      { ...lock, orderBy: { position: 'asc', createdAt: 'asc', id: 'asc' } },
    );
    existing = atStation.find((c) => c.type === input.type) ?? atStation[0] ?? null;
  }
  if (existing) {
    await em.populate(existing, ['station']);
    const replaced = betterTimingReplaced(
      {
        id: existing.id,
        station: existing.station.code,
        type: existing.type,
        source: existing.source,
        timingId: existing.timing?.id ?? null,
        disappearance: existing.disappearance,
        reappearance: existing.reappearance,
      },
      {
        type: input?.type ?? null,
        disappearance: input?.type === 'positive' ? (input.disappearance ?? null) : null,
        reappearance: input?.type === 'positive' ? (input.reappearance ?? null) : null,
        timingId: w.timing?.id ?? null,
        what: w.what,
        times: w.times,
      },
    );
    if (replaced && !w.replaceTimedChord)
      throw new ConflictError(replaced.message, REPLACES_BETTER_TIMING, replaced.detail);
  }
  const before: ChordBefore | null = existing
    ? {
        chordId: existing.id,
        source: existing.source,
        timingId: existing.timing?.id ?? null,
        reportId: existing.report?.id ?? null,
        type: existing.type,
        disappearance: existing.disappearance,
        reappearance: existing.reappearance,
        start: existing.startUtc,
        end: existing.endUtc,
      }
    : null;
  const source = w.timing ? 'timing' : 'report';
  if (!input) {
    if (existing) em.remove(existing);
    return { chord: null, before };
  }
  if (existing) {
    applyChordInput(existing, report.station, { ...input, timeOffsetSeconds: existing.timeOffsetSeconds });
    existing.source = source;
    existing.timing = w.timing;
    existing.report = report;
    return { chord: existing, before };
  }
  await assertEventRoom(em, report.event.id, { chords: 1 });
  const chord = chordRow(
    report.event,
    report.station,
    input,
    source,
    await nextChordPosition(em, report.event),
  );
  chord.timing = w.timing;
  chord.report = report;
  em.persist(chord);
  return { chord, before };
}

/** Replaces the report's ring events by its ring dips, placed after the event's last ring event. */
export async function writeReportRingEvents(em: EntityManager, report: Report): Promise<void> {
  if (report.ringDips.length > 0)
    await assertEventRoom(
      em,
      report.event.id,
      { ringEvents: report.ringDips.length },
      { ringEvents: await em.count(RingEvent, { report: report.id }) },
    );
  await em.nativeDelete(RingEvent, { report: report.id });
  const last = await em.findOne(RingEvent, { event: report.event.id }, { orderBy: { position: 'desc' } });
  let position = (last?.position ?? -1) + 1;
  for (const dip of report.ringDips) {
    const ring = new RingEvent(report.event, report.station, dip);
    ring.report = report;
    ring.position = position++;
    em.persist(ring);
  }
}
