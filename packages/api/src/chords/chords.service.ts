import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { ChordInput } from '@limbus/geometry';
import { chordPayloadSchema } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { NotFoundError, ValidationError } from '../common/domain-errors';
import type { OccultationEvent } from '../events/entities/occultation-event.entity';
import { applyChordInput, chordInput, chordRow } from '../events/event-rows';
import { assertEventRoom } from '../events/event-size';
import { EventsService } from '../events/events.service';
import { type ChordView, chordView } from '../events/views';
import { Station } from '../stations/entities/station.entity';
import { nextChordPosition } from './chord-position';
import { parseChordCsv, type ParsedChordRow } from './chord-csv';
import { Chord } from './entities/chord.entity';

export class CsvValidationError extends ValidationError {}

/**
 * The chord payload checked with the event file's chord schema. A refusal of the chord as a whole (a
 * positive chord with neither edge) names it as the event file would, `chords[i]` with i its index in the
 * event's list (docs/file-formats.md, "Event file"); other fields keep their own path.
 */
function parseChord(body: unknown, index: number): ChordInput {
  const parsed = chordPayloadSchema.safeParse(body);
  if (parsed.success) return parsed.data;
  throw new ValidationError(
    parsed.error.issues.map((i) => ({
      path: i.path.length > 0 ? i.path.map(String).join('.') : `chords[${index}]`,
      message: i.message,
    })),
  );
}

/** The times a chord holds (not its station or clock offset), to tell whether an edit changed them. */
function timesOf(c: Chord): string {
  const d = c.disappearance;
  const r = c.reappearance;
  return [c.type, d?.time, d?.sigmaSeconds, r?.time, r?.sigmaSeconds, c.startUtc, c.endUtc].join('|');
}

@Injectable()
export class ChordsService {
  constructor(
    private readonly em: EntityManager,
    private readonly events: EventsService,
    private readonly audit: AuditService,
  ) {}

  /**
   * The event's chords, in the event file's order: the detail view's own list, built once per revision
   * and cached, so a large event (up to EVENT_SIZE_LIMITS.chords) is not read again on every call.
   */
  async list(eventId: string): Promise<readonly ChordView[]> {
    return (await this.events.detail(eventId)).chords;
  }

  private async stationByCode(event: OccultationEvent, code: string): Promise<Station> {
    const station = await this.em.findOne(Station, { event, code });
    if (!station)
      throw new ValidationError([{ path: 'station', message: `unknown station "${code}" in this event` }]);
    return station;
  }

  async create(user: AuthUser, eventId: string, payload: unknown): Promise<ChordView> {
    const event = await this.events.find(eventId);
    const body = parseChord(payload, await this.em.count(Chord, { event }));
    const station = await this.stationByCode(event, body.station);
    const chord = await this.em.transactional(async (em) => {
      await assertEventRoom(em, eventId, { chords: 1 });
      const row = chordRow(event, station, body, 'manual', await nextChordPosition(em, event));
      em.persist(row);
      this.audit.record(em, {
        teamId: event.team.id,
        eventId,
        actorId: user.id,
        action: 'chord.create',
        objectType: 'chord',
        objectId: row.id,
        detail: { station: station.code, type: row.type },
      });
      await em.flush();
      return row;
    });
    return chordView(chord);
  }

  private async find(chordId: string): Promise<Chord> {
    const chord = await this.em.findOne(
      Chord,
      { id: chordId, event: { state: 'active' } },
      { populate: ['station', 'event', 'event.team'] },
    );
    if (!chord) throw new NotFoundError();
    return chord;
  }

  /**
   * The body's fields over the stored chord; a change of type starts from the body alone. An edge given
   * as null is dropped (a chord that keeps only the other edge becomes a single-edge chord).
   */
  async update(user: AuthUser, chordId: string, body: Record<string, unknown>): Promise<ChordView> {
    const chord = await this.find(chordId);
    const base = body.type === undefined || body.type === chord.type ? chordInput(chord) : {};
    const merged: Record<string, unknown> = { ...base, ...body };
    for (const edge of ['disappearance', 'reappearance']) if (merged[edge] === null) delete merged[edge];
    const order = await this.em.find(
      Chord,
      { event: chord.event },
      { fields: ['id'], orderBy: { position: 'asc', createdAt: 'asc', id: 'asc' } },
    );
    const input = parseChord(
      merged,
      order.findIndex((c) => c.id === chord.id),
    );
    const station = await this.stationByCode(chord.event, input.station);
    const before = { times: timesOf(chord), source: chord.source };
    applyChordInput(chord, station, input);
    // Hand-edited times are no longer the report's or the timing's; the chord still stands for its report.
    if (timesOf(chord) !== before.times) {
      chord.source = 'manual';
      chord.timing = null;
    }
    this.audit.record(this.em, {
      teamId: chord.event.team.id,
      eventId: chord.event.id,
      actorId: user.id,
      action: 'chord.update',
      objectType: 'chord',
      objectId: chord.id,
      detail: {
        fields: Object.keys(body),
        ...(chord.source === before.source ? {} : { source: { before: before.source, after: chord.source } }),
      },
    });
    await this.em.flush();
    return chordView(chord);
  }

  async remove(user: AuthUser, chordId: string): Promise<void> {
    const chord = await this.find(chordId);
    this.audit.record(this.em, {
      teamId: chord.event.team.id,
      eventId: chord.event.id,
      actorId: user.id,
      action: 'chord.delete',
      objectType: 'chord',
      objectId: chord.id,
      detail: { chord: chordInput(chord) },
    });
    this.em.remove(chord);
    await this.em.flush();
  }

  /** All rows or none: any bad row answers 400 listing every bad row, and nothing is written. */
  async importCsv(
    user: AuthUser,
    eventId: string,
    text: string | undefined,
    preview: boolean,
  ): Promise<{ chords: ChordInput[]; ids: string[] }> {
    if (text === undefined)
      throw new ValidationError([{ path: 'file', message: 'missing; send the CSV as field "file"' }]);
    const event = await this.events.find(eventId);
    const stations = await this.em.find(Station, { event });
    const byCode = new Map(stations.map((s) => [s.code, s]));
    const parsed = parseChordCsv(text, new Set(byCode.keys()));
    if (!parsed.ok) throw new CsvValidationError(parsed.problems);
    const chords = parsed.rows.map((r: ParsedChordRow) => r.chord);
    return this.em.transactional(async (em) => {
      // A preview says so too: the import it previews would be refused.
      await assertEventRoom(em, eventId, { chords: chords.length });
      if (preview) return { chords, ids: [] };
      let position = await nextChordPosition(em, event);
      const rows = chords.map((c) => {
        const station = byCode.get(c.station);
        if (!station) throw new Error(`station ${c.station} vanished during the import`);
        return chordRow(event, station, c, 'csv', position++);
      });
      em.persist(rows);
      this.audit.record(em, {
        teamId: event.team.id,
        eventId,
        actorId: user.id,
        action: 'chord.import',
        objectType: 'event',
        objectId: eventId,
        detail: { chords: rows.length },
      });
      await em.flush();
      return { chords, ids: rows.map((r) => r.id) };
    });
  }
}
