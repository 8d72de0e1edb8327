import {
  type CorrectionView,
  correctionViewSchema,
  REPLACES_BETTER_TIMING,
  type ReportView,
  reportViewSchema,
} from '@limbus/schema';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '../../src/audit/entities/audit-entry.entity';
import { Chord } from '../../src/chords/entities/chord.entity';
import { RingEvent } from '../../src/chords/entities/ring-event.entity';
import { Report } from '../../src/reports/entities/report.entity';
import { ReportCorrection } from '../../src/reports/entities/report-correction.entity';
import { User } from '../../src/users/entities/user.entity';
import { createWorkspace, importExample, patch, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

const mark = (time: string, sigmaSeconds: number) => ({ time, sigmaSeconds });
const POSITIVE = {
  result: 'positive',
  disappearance: mark('2028-03-14T02:13:58.20Z', 0.05),
  reappearance: mark('2028-03-14T02:14:19.80Z', 0.05),
};

describe('report decisions, corrections and their notices', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;
  const emails: Record<'coordinator' | 'observer', string> = { coordinator: '', observer: '' };

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
    const em = t.orm.em.fork();
    for (const role of ['coordinator', 'observer'] as const)
      emails[role] = (await em.findOneOrFail(User, { id: w.userIds[role] })).email;
  });
  afterAll(async () => {
    await t.close();
  });

  /** A station of its own for each test, so reports never meet another test's chord. */
  const newStation = async (code: string): Promise<string> => {
    const response = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code, latDeg: -29.9, lonDeg: -70.1, heightM: 800, observerId: w.userIds.observer })
      .expect(201);
    return (response.body as { id: string }).id;
  };
  const newReport = async (code: string, fields: Record<string, unknown> = POSITIVE): Promise<string> => {
    const response = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId: await newStation(code), ...fields })
      .expect(201);
    return (response.body as ReportView).id;
  };
  const acceptedReport = async (code: string): Promise<string> => {
    const id = await newReport(code);
    await t.post(`/api/reports/${id}/accept`).set(w.auth('coordinator')).expect(200);
    return id;
  };
  const viewOf = async (id: string): Promise<ReportView> => {
    const list = await t.get(`/api/events/${eventId}/reports`).set(w.auth('observer')).expect(200);
    const found = (list.body as ReportView[]).find((r) => r.id === id);
    if (!found) throw new Error(`report ${id} not listed`);
    return reportViewSchema.parse(found);
  };
  const requestCorrection = (
    id: string,
    changes: Record<string, unknown>,
    message = 'my clock was 0.3 s off',
  ) => t.post(`/api/reports/${id}/corrections`).set(w.auth('observer')).send({ changes, message });

  it('POST /api/reports/:reportId/accept and /reject tell the author; an edit of a rejected report tells the coordinators again', async () => {
    const id = await newReport('heron-scar');
    const submitted = await t.mailAbout(emails.coordinator, 'Report submitted: heron-scar');
    expect(submitted.kind).toBe('report-submitted');
    expect(submitted.text).toContain(`/events/${eventId}?section=stations`);
    const rejected = await t
      .post(`/api/reports/${id}/reject`)
      .set(w.auth('coordinator'))
      .send({ reason: 'the disappearance is before the predicted window' })
      .expect(200);
    expect(reportViewSchema.parse(rejected.body).state).toBe('rejected');
    const told = await t.mailAbout(emails.observer, 'Report rejected: heron-scar');
    expect(told.kind).toBe('report-decided');
    expect(told.text).toContain('Reason: the disappearance is before the predicted window');
    await patch(t, `/api/reports/${id}`)
      .set(w.auth('observer'))
      .send({ disappearance: mark('2028-03-14T02:13:58.40Z', 0.05) })
      .expect(200);
    expect((await t.mailAbout(emails.coordinator, 'Report resubmitted: heron-scar')).kind).toBe(
      'report-submitted',
    );
    await t.post(`/api/reports/${id}/accept`).set(w.auth('coordinator')).expect(200);
    expect((await t.mailAbout(emails.observer, 'Report accepted: heron-scar')).kind).toBe('report-decided');
    // Decisions go to the author only.
    expect((await t.mailTo(emails.coordinator, 0)).filter((m) => m.kind === 'report-decided')).toEqual([]);
  });

  it('POST /api/reports/:reportId/accept twice at once accepts once: one 200, one 409, one audit entry', async () => {
    const id = await newReport('gannet-reach');
    const [a, b] = await Promise.all([
      t.post(`/api/reports/${id}/accept`).set(w.auth('coordinator')),
      t.post(`/api/reports/${id}/accept`).set(w.auth('admin')),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const em = t.orm.em.fork();
    expect(await em.count(AuditEntry, { objectId: id, action: 'report.accept' })).toBe(1);
    expect(await em.count(Chord, { report: id })).toBe(1);
    const other = await newReport('skua-point');
    const [accept, reject] = await Promise.all([
      t.post(`/api/reports/${other}/accept`).set(w.auth('coordinator')),
      t.post(`/api/reports/${other}/reject`).set(w.auth('coordinator')).send({ reason: 'r' }),
    ]);
    expect([accept.status, reject.status].sort()).toEqual([200, 409]);
    const decisions = await em.find(AuditEntry, {
      objectId: other,
      action: { $in: ['report.accept', 'report.reject'] },
    });
    expect(decisions).toHaveLength(1);
    expect((await em.findOneOrFail(Report, { id: other })).state).toBe(
      decisions[0]?.action === 'report.accept' ? 'accepted' : 'rejected',
    );
  });

  it('POST /api/reports/:reportId/corrections is for the author of an accepted report, one at a time, checked as an edit', async () => {
    const submitted = await newReport('tern-hollow');
    await requestCorrection(submitted, { notes: 'x' }).expect(409);
    const id = await acceptedReport('tern-hollow-2');
    await t
      .post(`/api/reports/${id}/corrections`)
      .set(w.auth('coordinator'))
      .send({ changes: { notes: 'x' }, message: 'm' })
      .expect(403);
    const empty = await requestCorrection(id, {}).expect(400);
    expect((empty.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual([
      'changes',
    ]);
    const backwards = await requestCorrection(id, {
      reappearance: mark('2028-03-14T02:13:50Z', 0.05),
    }).expect(400);
    expect((backwards.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual([
      'changes.reappearance.time',
    ]);

    const changes = { disappearance: mark('2028-03-14T02:13:58.50Z', 0.03) };
    const [a, b] = await Promise.all([requestCorrection(id, changes), requestCorrection(id, changes)]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const made = correctionViewSchema.parse((a.status === 201 ? a : b).body);
    expect(made).toMatchObject({
      reportId: id,
      author: { id: w.userIds.observer },
      changes,
      message: 'my clock was 0.3 s off',
      state: 'pending',
      decidedBy: null,
    });
    const refused = (a.status === 409 ? a : b).body as { message: string };
    expect(refused.message).toBe('A correction of this report is already waiting for a coordinator');
    await requestCorrection(id, { notes: 'later' }).expect(409);
    expect(await t.orm.em.fork().count(ReportCorrection, { report: id })).toBe(1);

    const asked = await t.mailAbout(emails.coordinator, 'Correction requested: tern-hollow-2');
    expect(asked.kind).toBe('correction-requested');
    expect(asked.text).toContain('Fields to change: disappearance.');
    const view = await viewOf(id);
    expect(view.corrections.map((c) => c.id)).toEqual([made.id]);
    // Until a coordinator accepts it, the report and its chord keep what was accepted.
    expect(view.disappearance).toEqual(POSITIVE.disappearance);
    expect(view.chord?.disappearance).toEqual(POSITIVE.disappearance);
  });

  it('POST /api/reports/:reportId/corrections/:correctionId/accept applies the changes to the report and its chord', async () => {
    const id = await acceptedReport('petrel-cove');
    const changes = {
      disappearance: mark('2028-03-14T02:13:58.50Z', 0.03),
      ringDips: [
        { ring: 'R1', start: mark('2028-03-14T02:13:30Z', 0.1), end: mark('2028-03-14T02:13:30.4Z', 0.1) },
      ],
    };
    const made = (await requestCorrection(id, changes).expect(201)).body as CorrectionView;
    await t.post(`/api/reports/${id}/corrections/${made.id}/accept`).set(w.auth('observer')).expect(403);
    const accepted = await t
      .post(`/api/reports/${id}/corrections/${made.id}/accept`)
      .set(w.auth('coordinator'))
      .expect(200);
    const view = reportViewSchema.parse(accepted.body);
    expect(view.state).toBe('accepted');
    expect(view.disappearance).toEqual(changes.disappearance);
    expect(view.chord).toMatchObject({ source: 'report', disappearance: changes.disappearance });
    expect(view.corrections[0]).toMatchObject({
      id: made.id,
      state: 'accepted',
      decidedBy: { id: w.userIds.coordinator },
    });
    const em = t.orm.em.fork();
    const stored = await em.findOneOrFail(ReportCorrection, { id: made.id });
    expect(stored.state).toBe('accepted');
    expect(stored.openReportId).toBeNull();
    expect((await em.findOneOrFail(Chord, { report: id })).disappearance).toEqual(changes.disappearance);
    expect((await em.findOneOrFail(Report, { id })).ringDips).toEqual(changes.ringDips);
    expect(await em.count(RingEvent, { report: id })).toBe(1);
    const audit = await em.findOneOrFail(AuditEntry, { objectId: id, action: 'report.correction.accept' });
    expect(audit.detail).toMatchObject({
      correctionId: made.id,
      before: { disappearance: POSITIVE.disappearance },
    });
    expect((await t.mailAbout(emails.observer, 'Correction accepted: petrel-cove')).kind).toBe(
      'correction-decided',
    );
    await t.post(`/api/reports/${id}/corrections/${made.id}/accept`).set(w.auth('coordinator')).expect(409);
    // Once decided, the next correction may be asked for.
    await requestCorrection(id, { notes: 'seeing 2 arcsec' }).expect(201);
  });

  it('POST …/corrections/:correctionId/accept asks before replacing smaller σ, and replaces when told to', async () => {
    const id = await acceptedReport('fulmar-edge');
    const rough = {
      disappearance: mark('2028-03-14T02:13:58.0Z', 0.5),
      reappearance: mark('2028-03-14T02:14:20.0Z', 0.5),
    };
    const made = (await requestCorrection(id, rough).expect(201)).body as CorrectionView;
    const refused = await t
      .post(`/api/reports/${id}/corrections/${made.id}/accept`)
      .set(w.auth('coordinator'))
      .expect(409);
    expect(refused.body).toMatchObject({
      code: REPLACES_BETTER_TIMING,
      message:
        "the chord of fulmar-edge holds reported times with σ 0.05 s; the corrected report's times have σ 0.5 s",
      detail: {
        station: 'fulmar-edge',
        source: 'report',
        timingId: null,
        current: { disappearance: POSITIVE.disappearance, reappearance: POSITIVE.reappearance },
        incoming: rough,
      },
    });
    const em = t.orm.em.fork();
    expect((await em.findOneOrFail(ReportCorrection, { id: made.id })).state).toBe('pending');
    expect((await em.findOneOrFail(Report, { id })).disappearance).toEqual(POSITIVE.disappearance);
    const replaced = await t
      .post(`/api/reports/${id}/corrections/${made.id}/accept`)
      .set(w.auth('coordinator'))
      .send({ replaceTimedChord: true })
      .expect(200);
    expect(reportViewSchema.parse(replaced.body).chord).toMatchObject(rough);
  });

  it('POST …/corrections/:correctionId/reject keeps the report and tells the author why; corrections are listed newest first', async () => {
    const id = await acceptedReport('shag-rocks');
    const first = (await requestCorrection(id, { notes: 'thin cloud' }).expect(201)).body as CorrectionView;
    await t.post(`/api/reports/${id}/corrections/${first.id}/accept`).set(w.auth('coordinator')).expect(200);
    const second = (await requestCorrection(id, { result: 'clouded_out' }).expect(201))
      .body as CorrectionView;
    await t
      .post(`/api/reports/${id}/corrections/${second.id}/reject`)
      .set(w.auth('coordinator'))
      .send({ reason: ' ' })
      .expect(400);
    const rejected = await t
      .post(`/api/reports/${id}/corrections/${second.id}/reject`)
      .set(w.auth('coordinator'))
      .send({ reason: 'the light curve shows the event clearly' })
      .expect(200);
    const view = reportViewSchema.parse(rejected.body);
    expect(view.result).toBe('positive');
    expect(view.notes).toBe('thin cloud');
    expect(view.chord).not.toBeNull();
    expect(view.corrections.map((c) => [c.id, c.state, c.reason])).toEqual([
      [second.id, 'rejected', 'the light curve shows the event clearly'],
      [first.id, 'accepted', null],
    ]);
    const told = await t.mailAbout(emails.observer, 'Correction rejected: shag-rocks');
    expect(told.text).toContain('Reason: the light curve shows the event clearly');
    await t
      .post(`/api/reports/${id}/corrections/${second.id}/reject`)
      .set(w.auth('coordinator'))
      .send({ reason: 'again' })
      .expect(409);
    await t
      .post(`/api/reports/${id}/corrections/${first.id}x/reject`)
      .set(w.auth('coordinator'))
      .send({ reason: 'r' })
      .expect(404);
  });

  it('POST …/corrections/:correctionId/accept refuses changes that would leave an invalid report, naming the field', async () => {
    const id = await acceptedReport('auk-stack');
    // Stored as an older client could have: a negative without the end of its span.
    const em = t.orm.em.fork();
    const report = await em.findOneOrFail(Report, { id });
    const bad = new ReportCorrection(
      report,
      em.getReference(User, w.userIds.observer),
      {
        result: 'negative',
        observedFromUtc: '2028-03-14T02:10:00Z',
      },
      'not seen',
    );
    await em.persist(bad).flush();
    const refused = await t
      .post(`/api/reports/${id}/corrections/${bad.id}/accept`)
      .set(w.auth('coordinator'))
      .expect(400);
    expect((refused.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual([
      'changes.observedToUtc',
    ]);
    expect((await t.orm.em.fork().findOneOrFail(ReportCorrection, { id: bad.id })).state).toBe('pending');
  });
});
