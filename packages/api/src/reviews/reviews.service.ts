import { EntityManager } from '@mikro-orm/mariadb';
import { Injectable } from '@nestjs/common';
import type { ReviewDecisionPayload, ReviewEntry, ReviewRequestPayload } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth-user';
import { ConflictError, ForbiddenError, NotFoundError } from '../common/domain-errors';
import { FitRun, type ReviewState } from '../fits/entities/fit-run.entity';
import { fitLinkPath } from '../fits/fit-link';
import { NoticesService } from '../mail/notices.service';
import { FitsService } from '../fits/fits.service';
import { Membership } from '../teams/entities/membership.entity';
import { User } from '../users/entities/user.entity';
import { OccultationEvent } from '../events/entities/occultation-event.entity';
import { Review } from './entities/review.entity';

/** A request (by the fit's author, with their message), an approval or a return (with the comment). */
function reviewEntry(r: Review): ReviewEntry {
  return {
    id: r.id,
    fitId: r.fit.id,
    fitCreatedAt: r.fit.createdAt.toISOString(),
    decision: r.decision,
    comment: r.comment,
    reviewer: { id: r.reviewer.id, name: r.reviewer.name },
    createdAt: r.createdAt.toISOString(),
  };
}

/** solved → in review → approved | returned; a returned fit may be sent again. Approved is final. */
@Injectable()
export class ReviewsService {
  constructor(
    private readonly em: EntityManager,
    private readonly fits: FitsService,
    private readonly audit: AuditService,
    private readonly notices: NoticesService,
  ) {}

  /** The request is kept in the review history with the author's message, so reviewers see why. */
  async requestReview(
    user: AuthUser,
    fitId: string,
    body: ReviewRequestPayload,
  ): Promise<{ id: string; reviewState: ReviewState }> {
    const fit = await this.fits.find(fitId);
    if (fit.createdBy.id !== user.id)
      throw new ForbiddenError('Only the author of a fit can send it for review');
    if (fit.state !== 'solved')
      throw new ConflictError(`Only a solved fit can be reviewed; this one is ${fit.state}`);
    if (fit.reviewState === 'in_review' || fit.reviewState === 'approved')
      throw new ConflictError(`The fit is already ${fit.reviewState.replace('_', ' ')}`);
    // Conditional, so two requests at once move it only once.
    const moved = await this.em.nativeUpdate(
      FitRun,
      { id: fitId, reviewState: { $in: ['none', 'returned'] } },
      { reviewState: 'in_review' },
    );
    if (moved === 0) throw new ConflictError('The fit changed meanwhile; reload it');
    this.em.persist(new Review(fit, this.em.getReference(User, user.id), 'request', body.message));
    this.audit.record(this.em, {
      teamId: fit.event.team.id,
      eventId: fit.event.id,
      actorId: user.id,
      action: 'fit.review-request',
      objectType: 'fit',
      objectId: fit.id,
      ...(body.message === '' ? {} : { detail: { message: body.message } }),
    });
    await this.em.flush();
    const members = await this.em.find(Membership, { team: fit.event.team.id });
    this.notices.notify({
      kind: 'review-requested',
      to: members.filter((m) => m.roles.includes('reviewer') && m.user.id !== user.id).map((m) => m.user.id),
      subject: `Review requested: ${fit.event.title}`,
      lines: [
        `${fit.createdBy.name} asks you to review a fit of "${fit.event.title}".`,
        ...(body.message === '' ? [] : [`Message: ${body.message}`]),
      ],
      link: { path: fitLinkPath(fit.event.id, fit.id), label: 'Open the fit' },
    });
    return { id: fit.id, reviewState: 'in_review' };
  }

  async decide(user: AuthUser, fitId: string, body: ReviewDecisionPayload): Promise<ReviewEntry> {
    const fit = await this.fits.find(fitId);
    if (fit.createdBy.id === user.id) throw new ForbiddenError('A fit cannot be reviewed by its own author');
    if (fit.reviewState !== 'in_review') throw new ConflictError('The fit is not waiting for review');
    const next: ReviewState = body.decision === 'approve' ? 'approved' : 'returned';
    const review = new Review(fit, this.em.getReference(User, user.id), body.decision, body.comment);
    await this.em.transactional(async (em) => {
      const moved = await em.nativeUpdate(
        FitRun,
        { id: fitId, reviewState: 'in_review' },
        { reviewState: next },
      );
      if (moved === 0) throw new ConflictError('Another reviewer decided meanwhile');
      em.persist(review);
      this.audit.record(em, {
        teamId: fit.event.team.id,
        eventId: fit.event.id,
        actorId: user.id,
        action: `fit.review.${body.decision}`,
        objectType: 'fit',
        objectId: fit.id,
        detail: { comment: body.comment },
      });
      await em.flush();
    });
    const reviewer = await this.em.findOneOrFail(User, { id: user.id });
    this.notices.notify({
      kind: 'review-decided',
      to: [fit.createdBy.id],
      subject:
        body.decision === 'approve' ? `Fit approved: ${fit.event.title}` : `Fit returned: ${fit.event.title}`,
      lines: [
        `${reviewer.name} ${body.decision === 'approve' ? 'approved' : 'returned'} your fit of "${fit.event.title}".`,
        ...(body.comment ? [`Comment: ${body.comment}`] : []),
      ],
      link: { path: fitLinkPath(fit.event.id, fit.id), label: 'Open the fit' },
    });
    return reviewEntry(
      await this.em.findOneOrFail(Review, { id: review.id }, { populate: ['reviewer', 'fit'] }),
    );
  }

  async list(fitId: string): Promise<ReviewEntry[]> {
    const fit = await this.fits.find(fitId);
    const reviews = await this.em.find(
      Review,
      { fit },
      { populate: ['reviewer', 'fit'], orderBy: { createdAt: 'asc', id: 'asc' } },
    );
    return reviews.map(reviewEntry);
  }

  /** Every fit's history of one event, oldest first: a re-run keeps the earlier reviews in sight. */
  async listForEvent(eventId: string): Promise<ReviewEntry[]> {
    const event = await this.em.findOne(OccultationEvent, { id: eventId, state: 'active' });
    if (!event) throw new NotFoundError();
    const reviews = await this.em.find(
      Review,
      { fit: { event } },
      { populate: ['reviewer', 'fit'], orderBy: { createdAt: 'asc', id: 'asc' } },
    );
    return reviews.map(reviewEntry);
  }
}
