// The demo scenario a newcomer sees on first start: the invented event of quillon-event.json (made
// once by tools/demo/make-demo-event.ts; its prediction section added by hand) with its stations, a report
// per station from invented observers, accepted by the demo coordinator into chords and ring events, and
// one fit solved here by the real geometry engine, sent for review and approved by the demo reviewer; and
// for planning, the prediction settings, two planned sites and one an observer proposed.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { EntityManager } from '@mikro-orm/mariadb';
import { solveEvent, ENGINE_VERSION } from '@limbus/geometry';
import { type ContextInputFile, validateContextInput, validateEventFile } from '@limbus/schema';
import { AuditService } from '../audit/audit.service';
import { Body } from '../bodies/entities/body.entity';
import { RingEvent } from '../chords/entities/ring-event.entity';
import { OccultationEvent } from '../events/entities/occultation-event.entity';
import { DynamicsContext } from '../dynamics/entities/dynamics-context.entity';
import { defaultEventTimeUtc, eventDataSha256 } from '../events/event-data';
import { chordRow, eventFileOf, loadEventRows, persistEventFile } from '../events/event-rows';
import { FitRun } from '../fits/entities/fit-run.entity';
import { sha256Hex } from '../common/tokens';
import { Report, type ReportResult } from '../reports/entities/report.entity';
import { chordOfReport } from '../reports/reports.service';
import { Review } from '../reviews/entities/review.entity';
import { Station } from '../stations/entities/station.entity';
import { Membership } from '../teams/entities/membership.entity';
import { Team } from '../teams/entities/team.entity';
import { User } from '../users/entities/user.entity';

/** Beside the compiled file in dist/demo and the source in src/demo alike. */
export const DEMO_EVENT_PATH = path.resolve(__dirname, '../../src/demo/quillon-event.json');

/** The invented body of the demo event. */
export const DEMO_BODY = { name: 'Quillon', designation: '2027 QL88' } as const;

/**
 * Quillon's invented physical parameters (limbus-context-input/1), near what the demo event's limb gives
 * (an equivalent radius of about 365 km); every source says it is invented.
 */
export const DEMO_BODY_CONTEXT: ContextInputFile = {
  format: 'limbus-context-input/1',
  body: {
    densityKgM3: 1200,
    densityKgM3Sigma: 300,
    densityKgM3Source: 'invented for the demo: an icy-rock mix assumed',
    radiusKm: 365,
    radiusKmSigma: 8,
    radiusKmSource: 'invented for the demo: equivalent radius of the 2029 limb',
    spinPeriodHours: 7.8,
    spinPeriodHoursSigma: 0.2,
    spinPeriodHoursSource: 'invented for the demo: light-curve period',
  },
  particleDensityKgM3: 900,
  particleDensityKgM3Source: 'invented for the demo: water ice',
  heliocentricDistanceAu: 38.2,
  heliocentricDistanceAuSigma: 0.01,
  heliocentricDistanceAuSource: 'invented for the demo: ephemeris at the event',
  satellites: [
    {
      name: 'Tessel',
      semiMajorAxisKm: 6200,
      semiMajorAxisKmSigma: 150,
      semiMajorAxisKmSource: 'invented for the demo',
    },
  ],
  rings: [],
};

/** Invented observers; observer@example.org (a demo user) holds the first two sites. */
export const DEMO_OBSERVERS: ReadonlyArray<{
  station: string;
  name: string;
  email: string | null;
  camera: string;
}> = [
  {
    station: 'tarrow-knoll',
    name: 'Ilse Darrow',
    email: 'observer@example.org',
    camera: 'CMOS video, 25 fps',
  },
  {
    station: 'vesper-flats',
    name: 'Ilse Darrow',
    email: 'observer@example.org',
    camera: 'CMOS video, 25 fps',
  },
  { station: 'ombry-ridge', name: 'Bram Oakes', email: 'bram.oakes@example.org', camera: 'EMCCD, 10 fps' },
  {
    station: 'castellan-mesa',
    name: 'Jun Halloway',
    email: 'jun.halloway@example.org',
    camera: 'CMOS video, 30 fps',
  },
  {
    station: 'lindquist-farm',
    name: 'Odile Prent',
    email: 'odile.prent@example.org',
    camera: 'CCD drift scan',
  },
  {
    station: 'saltmarsh-point',
    name: 'Teo Varga',
    email: 'teo.varga@example.org',
    camera: 'CMOS video, 25 fps',
  },
  {
    station: 'pennick-down',
    name: 'Rhea Soll',
    email: 'rhea.soll@example.org',
    camera: 'CMOS video, 20 fps',
  },
  {
    station: 'wrenfold-hill',
    name: 'Cass Imbert',
    email: 'cass.imbert@example.org',
    camera: 'EMCCD, 12 fps',
  },
  {
    station: 'hobb-observatory',
    name: 'Arno Hobb',
    email: 'arno.hobb@example.org',
    camera: 'CMOS video, 25 fps',
  },
  {
    station: 'marrin-station',
    name: 'Lise Marrin',
    email: 'lise.marrin@example.org',
    camera: 'CMOS video, 25 fps',
  },
];

/**
 * Sites planned ahead by the coordinator where the stations above leave the widest gaps across the body
 * (the placement's own suggestions for this event, rounded), and one an observer proposed for the ring.
 * Invented, like everything here.
 */
export const DEMO_PLANNED_SITES: ReadonlyArray<{
  code: string;
  latDeg: number;
  lonDeg: number;
  heightM: number;
  status: 'planned' | 'proposed';
  observerEmail: string;
  notes: string | null;
}> = [
  {
    code: 'corrie-gap',
    latDeg: 12.2413,
    lonDeg: 71.664,
    heightM: 120,
    status: 'planned',
    observerEmail: 'observer@example.org',
    notes: null,
  },
  {
    code: 'fenwick-shoal',
    latDeg: 6.3003,
    lonDeg: 70.3328,
    heightM: 40,
    status: 'planned',
    observerEmail: 'bram.oakes@example.org',
    notes: null,
  },
  {
    code: 'darrow-lookout',
    latDeg: 17.0875,
    lonDeg: 72.7913,
    heightM: 210,
    status: 'proposed',
    observerEmail: 'observer@example.org',
    notes:
      "A friend's farmhouse roof, clear to the south; the owner agrees. Outside the body's path: for the ring.",
  },
];

const NOT_OBSERVED: Record<string, { result: ReportResult; notes: string }> = {
  'hobb-observatory': {
    result: 'clouded_out',
    notes: 'Cirrus moved in ten minutes before; no usable frames.',
  },
  'marrin-station': {
    result: 'technical_failure',
    notes: 'Camera stopped recording at 21:39 UTC (USB dropout).',
  },
};

/**
 * Idempotent: does nothing when the demo team already has an event. The invented observers get the
 * demo users' password hash, so that any of them can sign in too.
 */
export async function seedDemoScenario(em: EntityManager, teamName: string): Promise<string> {
  const team = await em.findOne(Team, { name: teamName });
  if (!team) return 'demo scenario: no demo team, nothing to do';
  if ((await em.count(OccultationEvent, { team })) > 0) return 'demo scenario: already present';
  const byEmail = async (email: string) => em.findOneOrFail(User, { email });
  const coordinator = await byEmail('coordinator@example.org');
  const modeller = await byEmail('modeller@example.org');
  const reviewer = await byEmail('reviewer@example.org');
  const passwordHash = coordinator.passwordHash;
  const audit = new AuditService();

  const validation = validateEventFile(JSON.parse(readFileSync(DEMO_EVENT_PATH, 'utf8')));
  if (!validation.ok)
    throw new Error(
      `demo event file: ${validation.problems.map((p) => `${p.path}: ${p.message}`).join('; ')}`,
    );
  const file = validation.event;

  await em.transactional(async (tx) => {
    const body = new Body(team, DEMO_BODY.name);
    body.designation = DEMO_BODY.designation;
    body.createdById = coordinator.id;
    const context = validateContextInput(DEMO_BODY_CONTEXT);
    if (!context.ok) throw new Error(`demo body context: ${JSON.stringify(context.problems)}`);
    tx.persist([body, new DynamicsContext(body, context.file, coordinator)]);
    const rows = persistEventFile(tx, team, body, { ...file, chords: [], ringEvents: [] }, coordinator.id);
    const event = rows.event;
    event.eventTimeUtc = defaultEventTimeUtc(file);
    event.prediction = validation.prediction ?? null;
    const observers = new Map<string, User>();
    for (const o of DEMO_OBSERVERS) {
      if (!o.email || observers.has(o.email)) continue;
      let user = await tx.findOne(User, { email: o.email });
      if (!user) {
        user = new User(o.email, o.name, passwordHash);
        tx.persist([user, new Membership(team, user, ['observer'])]);
      }
      observers.set(o.email, user);
    }
    let chordPosition = 0;
    let ringPosition = 0;
    for (const station of rows.stations) {
      const who = DEMO_OBSERVERS.find((o) => o.station === station.code);
      const author = who?.email ? observers.get(who.email) : undefined;
      if (!who || !author) throw new Error(`demo station ${station.code} has no observer`);
      station.observer = author;
      station.observerName = who.name;
      station.camera = who.camera;
      station.apertureMm = 200 + 50 * (station.position % 4);
      station.exposureSeconds = 0.04;
      station.timeSource = 'GNSS 1 PPS';
      const chord = file.chords.find((c) => c.station === station.code);
      const missed = NOT_OBSERVED[station.code];
      const report = new Report(event, station, author, chord?.type ?? missed?.result ?? 'clouded_out');
      if (chord?.type === 'positive') {
        report.disappearance = chord.disappearance ?? null;
        report.reappearance = chord.reappearance ?? null;
      } else if (chord?.type === 'negative') {
        report.observedFromUtc = chord.start;
        report.observedToUtc = chord.end;
      }
      report.notes = missed?.notes ?? null;
      report.ringDips = file.ringEvents
        .filter((r) => r.station === station.code)
        .map((r) => ({ ring: r.ring, start: r.start, end: r.end }));
      report.state = 'accepted';
      tx.persist(report);
      const input = chordOfReport(report);
      if (input) {
        const row = chordRow(event, station, input, 'report', chordPosition++);
        row.report = report;
        tx.persist(row);
      }
      for (const dip of report.ringDips) {
        const ring = new RingEvent(event, station, dip);
        ring.report = report;
        ring.position = ringPosition++;
        tx.persist(ring);
      }
      audit.record(tx, {
        teamId: team.id,
        eventId: event.id,
        actorId: coordinator.id,
        action: 'report.accept',
        objectType: 'report',
        objectId: report.id,
        detail: { seeded: true },
      });
    }
    let position = rows.stations.length;
    for (const site of DEMO_PLANNED_SITES) {
      const observer = observers.get(site.observerEmail);
      if (!observer) throw new Error(`demo site ${site.code} has no observer`);
      const station = new Station(event, site);
      station.status = site.status;
      station.observer = observer;
      station.observerName = observer.name;
      station.notes = site.notes;
      station.position = ++position;
      tx.persist(station);
    }
    await tx.flush();

    const snapshot = eventFileOf(await loadEventRows(tx, event));
    const input = JSON.stringify(snapshot);
    const inputSha256 = sha256Hex(input);
    const solution = solveEvent(snapshot, { inputSha256 });
    const fit = new FitRun(event, modeller, {
      input,
      inputSha256,
      dataSha256: eventDataSha256(snapshot),
      options: {},
      engineVersion: ENGINE_VERSION,
      seed: solution.engine.seed,
      idempotencyKey: null,
    });
    fit.state = 'solved';
    fit.progress = 100;
    fit.solution = solution;
    fit.startedAt = new Date();
    fit.finishedAt = new Date();
    fit.attempts = 1;
    fit.reviewState = 'approved';
    tx.persist(fit);
    tx.persist(
      new Review(
        fit,
        reviewer,
        'approve',
        'Limb and ring agree with the negatives; ring seen on both sides. Approved.',
      ),
    );
    audit.record(tx, {
      teamId: team.id,
      eventId: event.id,
      actorId: reviewer.id,
      action: 'fit.review.approve',
      objectType: 'fit',
      objectId: fit.id,
      detail: { seeded: true },
    });
    await tx.flush();
  });
  return (
    `demo scenario: event "${file.title}" with ${file.stations.length} stations, ` +
    `${DEMO_PLANNED_SITES.length} planned or proposed sites, a prediction and an approved fit`
  );
}
