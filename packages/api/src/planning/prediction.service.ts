import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import { GeometryInputError, type PredictionSettings, predictEvent } from '@limbus/geometry';
import type { OffsetFromFitAnswer, PredictionOffsetSource } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, NotFoundError, ValidationError } from '../common/domain-errors';
import { loadEventRows, planningFileOf } from '../events/event-rows';
import { EventsService } from '../events/events.service';
import { FitRun } from '../fits/entities/fit-run.entity';
import { type PlanningSnapshot, PredictionCache } from './prediction-cache';

const NO_SETTINGS =
  'the event has no prediction settings: give at least prediction.bodyRadiusKm (PATCH /api/events/:eventId)';

/** 409 naming `prediction`: the route needs settings that a coordinator has not given yet. */
export function noPredictionSettings(): ConflictError {
  return new ConflictError(NO_SETTINGS, 'no-prediction-settings', {
    issues: [{ path: 'prediction', message: NO_SETTINGS }],
  });
}

const DAY_MS = 86_400_000;

/**
 * The event's prediction: the same computation `limbus predict` runs on the event's exported file,
 * cached per process under the event's revision (the settings are a column of the event, so changing
 * them raises it too).
 */
@Injectable()
export class PredictionService {
  constructor(
    private readonly em: EntityManager,
    private readonly events: EventsService,
    private readonly audit: AuditService,
    private readonly cache: PredictionCache,
  ) {}

  async current(eventId: string): Promise<PlanningSnapshot> {
    const [row] = await this.em
      .getConnection()
      .execute<Array<{ state: string; revision: number }>>(
        'select `state`, `revision` from `events` where `id` = ? limit 1',
        [eventId],
      );
    if (!row || row.state === 'deleted') throw new NotFoundError();
    const cached = this.cache.get(eventId, row.revision);
    if (cached) return cached;
    const event = await this.events.find(eventId);
    const settings = event.prediction;
    if (settings === null) throw noPredictionSettings();
    const rows = await loadEventRows(this.em, event);
    await this.em.populate(rows.stations, ['observer']);
    const file = planningFileOf(rows);
    let prediction;
    try {
      prediction = predictEvent(file, settings);
    } catch (error) {
      // Settings that passed their own checks can still disagree with the event (an ephemeris edited
      // since, so that `from` falls outside it): the same problems the CLI reports, by JSON path.
      if (error instanceof GeometryInputError)
        throw new ValidationError([{ path: error.path, message: error.detail }]);
      throw error;
    }
    const snapshot: PlanningSnapshot = {
      eventId,
      teamId: event.team.id,
      title: event.title,
      bodyName: event.body.name,
      eventTimeUtc: event.eventTimeUtc,
      offsetSource: event.predictionSource,
      stations: rows.stations.map((s) => ({
        id: s.id,
        code: s.code,
        status: s.status,
        observerId: s.observer?.id ?? null,
        observerName: s.observerName ?? s.observer?.name ?? null,
        latDeg: s.latDeg,
        lonDeg: s.lonDeg,
        heightM: s.heightM,
      })),
      file,
      settings,
      prediction,
    };
    this.cache.set(eventId, row.revision, snapshot);
    return snapshot;
  }

  /**
   * Takes the astrometric offset (Δα·cos δ, Δδ) and its 1σ that a solved fit of an earlier event of the same
   * team and body measured, as the prediction's offsetMas and uncertaintyMas, and records which fit it was.
   */
  async offsetFromFit(user: AuthUser, eventId: string, fitId: string): Promise<OffsetFromFitAnswer> {
    const event = await this.events.find(eventId);
    if (event.prediction === null) throw noPredictionSettings();
    const refuse = (message: string) => new ValidationError([{ path: 'fitId', message }]);
    const fit = await this.em.findOne(
      FitRun,
      { id: fitId },
      { populate: ['event', 'event.body', 'solution'] },
    );
    // Another team's fit is answered exactly as a missing one, so ids of other teams cannot be confirmed.
    if (!fit || fit.event.team.id !== event.team.id || fit.event.state === 'deleted')
      throw refuse('no such fit in this team');
    if (fit.event.id === event.id)
      throw refuse('this is a fit of this event itself; take the offset from a fit of an earlier event');
    if (fit.event.body.id !== event.body.id)
      throw refuse(
        `the fit is of ${fit.event.body.name}, this event of ${event.body.name}: an offset carries only within one body's ephemeris`,
      );
    if (!(fit.event.eventTimeUtc < event.eventTimeUtc))
      throw refuse(
        `the fit's event (${fit.event.eventTimeUtc}) is not earlier than this one (${event.eventTimeUtc})`,
      );
    if (fit.state !== 'solved' || fit.solution === null)
      throw refuse(`the fit is ${fit.state}; only a solved fit has an astrometric offset`);
    const astrometry = fit.solution.astrometry;
    if (astrometry === null)
      throw refuse(
        'the fit has no astrometry (no limb or ring centre was fitted): there is no offset to take',
      );

    const offsetMas = { raCosDec: astrometry.raOffsetCosDecMas, dec: astrometry.decOffsetMas };
    const uncertaintyMas = {
      raCosDec: astrometry.uncertainty.raOffsetCosDecMas,
      dec: astrometry.uncertainty.decOffsetMas,
    };
    const carriedDays = (Date.parse(event.eventTimeUtc) - Date.parse(astrometry.referenceTimeUtc)) / DAY_MS;
    const source: PredictionOffsetSource = {
      fitId: fit.id,
      eventId: fit.event.id,
      eventTitle: fit.event.title,
      eventTimeUtc: fit.event.eventTimeUtc,
      referenceTimeUtc: astrometry.referenceTimeUtc,
      reviewState: fit.reviewState,
      offsetMas,
      uncertaintyMas,
      appliedAt: new Date().toISOString(),
      appliedById: user.id,
      carriedDays,
    };
    const before: PredictionSettings = event.prediction;
    const prediction: PredictionSettings = { ...before, offsetMas, uncertaintyMas };
    event.prediction = prediction;
    event.predictionSource = source;
    this.audit.record(this.em, {
      teamId: event.team.id,
      eventId,
      actorId: user.id,
      action: 'event.prediction.offset-from-fit',
      objectType: 'event',
      objectId: eventId,
      detail: {
        fitId: fit.id,
        fitEventId: fit.event.id,
        offsetMas,
        uncertaintyMas,
        previous: { offsetMas: before.offsetMas, uncertaintyMas: before.uncertaintyMas },
      },
    });
    await this.em.flush();
    return { prediction: { ...prediction }, offsetSource: source, assumptions: offsetAssumptions(source) };
  }
}

/** What taking an earlier fit's offset assumes, said with every answer and shown beside the settings. */
export function offsetAssumptions(source: PredictionOffsetSource): string[] {
  const days = Math.round(source.carriedDays);
  const list = [
    `The body's offset from its ephemeris is taken as constant from the fit's reference time ` +
      `(${source.referenceTimeUtc.slice(0, 19).replace('T', ' ')} UTC) to this event, ${days} days later; ` +
      'an ephemeris error changes along the orbit, so the longer the gap the less it holds.',
    "This event's ephemeris must come from the same orbit solution as the fitted event's: an offset " +
      'measured against one ephemeris does not carry to another.',
    "The σ is the fitted centre's 1σ alone: it leaves out the error of this event's star position and " +
      'the drift of the ephemeris since; widen uncertaintyMas by hand where those are known.',
  ];
  if (source.reviewState !== 'approved')
    list.push(`The fit is not approved (review state: ${source.reviewState}).`);
  if (source.uncertaintyMas.raCosDec === 0 || source.uncertaintyMas.dec === 0)
    list.push(
      'A σ of 0 means the fit held its centre fixed: the offset was not measured there; set uncertaintyMas by hand.',
    );
  return list;
}
