import { EntityManager, MikroORM, UniqueConstraintViolationException } from '@mikro-orm/mariadb';
import { InjectQueue } from '@nestjs/bullmq';
import { Injectable, Logger, type MessageEvent } from '@nestjs/common';
import { DEFAULT_SEED, ENGINE_VERSION } from '@limbus/geometry';
import { type SubmitFitPayload, validateEventFile } from '@limbus/schema';
import type { Queue } from 'bullmq';
import { Observable } from 'rxjs';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { NotFoundError, UnprocessableError, ValidationError } from '../common/domain-errors';
import { sha256Hex } from '../common/tokens';
import { canonicalJson, eventDataSha256 } from '../events/event-data';
import { eventFileOf, loadEventRows } from '../events/event-rows';
import { EventsService } from '../events/events.service';
import { enqueueOrLeaveToSweep } from '../queue/bounded-enqueue';
import { FITS_QUEUE } from '../queue/queue.module';
import { User } from '../users/entities/user.entity';
import { FitRun } from './entities/fit-run.entity';
import { overlayFitOptions } from './fit-options';
import { enqueueFit, type FitJobData } from './fit-queue';
import { fitSummaryView, type FitSummaryView, type FitView, fitView } from './fit-view';

/**
 * The fit an earlier request with the same Idempotency-Key made, when this request's body is the same.
 * Fits stored before bodies were hashed (no hash) are returned as before.
 */
function replayed(fit: FitRun, requestSha256: string): { id: string } {
  if (fit.requestSha256 !== null && fit.requestSha256 !== requestSha256)
    throw new UnprocessableError(
      'This Idempotency-Key was already used for a fit with other options: send a new key for a new request',
    );
  return { id: fit.id };
}

/** How often the progress stream looks at the fit row; the row, not this process, is the truth. */
const STREAM_POLL_MS = 150;

@Injectable()
export class FitsService {
  private readonly logger = new Logger(FitsService.name);

  constructor(
    private readonly em: EntityManager,
    private readonly orm: MikroORM,
    private readonly events: EventsService,
    private readonly audit: AuditService,
    @InjectQueue(FITS_QUEUE) private readonly queue: Queue<FitJobData>,
  ) {}

  /**
   * The snapshot is the event file built from the rows now, so later edits do not reach a queued
   * fit. A retried submit with the same Idempotency-Key (same user, same event) and the same body
   * returns the first fit; the same key with another body answers 422 (answering with the first fit
   * would silently drop what this request asked for). The body is compared by the SHA-256 of its
   * canonical JSON as validated (defaults applied, key order ignored).
   */
  async submit(
    user: AuthUser,
    eventId: string,
    body: SubmitFitPayload,
    idempotencyKey: string | null,
  ): Promise<{ id: string }> {
    const event = await this.events.find(eventId);
    const requestSha256 = sha256Hex(canonicalJson(body));
    if (idempotencyKey) {
      const existing = await this.em.findOne(FitRun, { event, createdBy: user.id, idempotencyKey });
      if (existing) return replayed(existing, requestSha256);
    }
    const rows = await loadEventRows(this.em, event);
    const file = eventFileOf(
      rows,
      overlayFitOptions(event.fitDefaults, body.options) as typeof event.fitDefaults,
    );
    const validation = validateEventFile(file);
    if (!validation.ok)
      throw new ValidationError(
        validation.problems.map((p) => ({
          path: p.path.startsWith('fit.')
            ? `options.${p.path.slice(4)}`
            : p.path === 'fit'
              ? 'options'
              : p.path,
          message: p.path.startsWith('fit') ? p.message : `event: ${p.message}`,
        })),
      );
    const input = JSON.stringify(validation.event);
    const fit = new FitRun(event, this.em.getReference(User, user.id), {
      input,
      inputSha256: sha256Hex(input),
      dataSha256: eventDataSha256(validation.event),
      options: body.options,
      engineVersion: ENGINE_VERSION,
      seed: validation.event.fit.seed ?? DEFAULT_SEED,
      idempotencyKey,
    });
    fit.requestSha256 = requestSha256;
    try {
      await this.em.transactional(async (em) => {
        em.persist(fit);
        this.audit.record(em, {
          teamId: event.team.id,
          eventId,
          actorId: user.id,
          action: 'fit.submit',
          objectType: 'fit',
          objectId: fit.id,
          detail: { inputSha256: fit.inputSha256, options: body.options },
        });
        await em.flush();
      });
    } catch (error) {
      // Two retries racing with one key: the unique index lets one in; the other answers with it.
      if (error instanceof UniqueConstraintViolationException && idempotencyKey) {
        const winner = await this.em
          .fork()
          .findOne(FitRun, { event: eventId, createdBy: user.id, idempotencyKey });
        if (winner) return replayed(winner, requestSha256);
      }
      throw error;
    }
    await enqueueOrLeaveToSweep(enqueueFit(this.queue, fit.id), `fit ${fit.id}`, this.logger);
    return { id: fit.id };
  }

  async find(fitId: string, withSolution = false): Promise<FitRun> {
    const fit = await this.em.findOne(
      FitRun,
      { id: fitId, event: { state: 'active' } },
      { populate: withSolution ? ['createdBy', 'event', 'solution'] : ['createdBy', 'event'] },
    );
    if (!fit) throw new NotFoundError();
    return fit;
  }

  async get(fitId: string): Promise<FitView> {
    const fit = await this.find(fitId, true);
    return fitView(fit, (await this.events.detail(fit.event.id)).dataSha256);
  }

  async list(eventId: string): Promise<FitSummaryView[]> {
    const event = await this.events.find(eventId);
    const fits = await this.em.find(
      FitRun,
      { event },
      { populate: ['createdBy'], orderBy: { createdAt: 'desc', id: 'desc' } },
    );
    const current = (await this.events.detail(eventId)).dataSha256;
    return fits.map((f) => fitSummaryView(f, current));
  }

  /** Server-sent events: `progress` and `state` as the row changes; ends once solved or failed. */
  stream(fitId: string): Observable<MessageEvent> {
    return new Observable<MessageEvent>((subscriber) => {
      let stopped = false;
      let timer: NodeJS.Timeout | undefined;
      let lastState = '';
      let lastProgress = -1;
      const poll = async (): Promise<void> => {
        if (stopped) return;
        const fit = await this.orm.em
          .fork()
          .findOne(FitRun, { id: fitId }, { fields: ['state', 'progress'] });
        if (!fit) {
          subscriber.complete();
          return;
        }
        if (fit.progress !== lastProgress) {
          lastProgress = fit.progress;
          subscriber.next({ type: 'progress', data: { progress: fit.progress } });
        }
        if (fit.state !== lastState) {
          lastState = fit.state;
          subscriber.next({ type: 'state', data: { state: fit.state } });
        }
        if (fit.state === 'solved' || fit.state === 'failed') {
          subscriber.complete();
          return;
        }
        timer = setTimeout(
          () => void poll().catch((error: unknown) => subscriber.error(error)),
          STREAM_POLL_MS,
        );
      };
      void poll().catch((error: unknown) => subscriber.error(error));
      return () => {
        stopped = true;
        if (timer) clearTimeout(timer);
      };
    });
  }
}
