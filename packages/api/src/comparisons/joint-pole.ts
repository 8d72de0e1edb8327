// The joint ring pole of several stored fits: the same geometry functions as `limbus joint`
// (tools/cli/src/commands/joint.ts), fed with each fit's frozen input instead of a file, so a queued job
// and the command give the same document for the same events.
import {
  fitJointPole,
  GeometryInputError,
  jointEventFromInput,
  ringLabels,
  type EventInput,
  type JointEvent,
} from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import type { FieldIssue } from '../common/domain-errors';

export interface JointFitInput {
  fitId: string;
  /** The fit's event file (limbus-event/1) exactly as stored. */
  input: string;
}

export interface JointPoleDocument {
  format: 'limbus-joint/1';
  ring: string;
  pole: { raDeg: number; decDeg: number };
  uncertainty: { raDeg: number; decDeg: number };
  radiusKm: number;
  radiusSigmaKm: number;
  chi2: number;
  dof: number;
  events: Array<{ fitId: string; title: string; openingAngleDeg: number; positionAngleDeg: number }>;
  ambiguityResolved: boolean;
  alternativePole: { raDeg: number; decDeg: number; chi2: number };
}

/** Problems a person can fix (wrong ring, an event without its dips), each naming the fit. */
export class JointInputProblems extends Error {
  constructor(readonly issues: FieldIssue[]) {
    super(issues.map((i) => `${i.path}: ${i.message}`).join('; '));
    this.name = 'JointInputProblems';
  }
}

export function jointPole(fits: JointFitInput[], requestedRing: string | null): JointPoleDocument {
  const events: EventInput[] = fits.map((f) => {
    const v = validateEventFile(JSON.parse(f.input));
    if (!v.ok) throw new Error(`stored input of fit ${f.fitId} no longer validates`);
    return v.event;
  });
  const first = events[0];
  if (first === undefined) throw new JointInputProblems([{ path: 'fitIds', message: 'no fits given' }]);
  const ring = requestedRing ?? ringLabels(first)[0];
  if (ring === undefined)
    throw new JointInputProblems([
      {
        path: `fit ${fits[0]?.fitId}`,
        message: 'has no ring events, so there is no ring to fit (name one with ring)',
      },
    ]);
  const issues: FieldIssue[] = [];
  const jointEvents: JointEvent[] = [];
  events.forEach((event, k) => {
    const path = `fit ${fits[k]?.fitId} (${event.title})`;
    try {
      jointEvents.push(jointEventFromInput(event, ring, path));
    } catch (error) {
      if (!(error instanceof GeometryInputError)) throw error;
      issues.push({ path: error.path, message: error.detail });
    }
  });
  if (issues.length > 0) throw new JointInputProblems(issues);
  let fit: ReturnType<typeof fitJointPole>;
  try {
    fit = fitJointPole(jointEvents);
  } catch (error) {
    if (error instanceof GeometryInputError)
      throw new JointInputProblems([{ path: error.path, message: error.detail }]);
    throw error;
  }
  return {
    format: 'limbus-joint/1',
    ring,
    pole: fit.pole,
    uncertainty: fit.uncertainty,
    radiusKm: fit.radiusKm,
    radiusSigmaKm: fit.radiusSigmaKm,
    chi2: fit.chi2,
    dof: fit.dof,
    events: fit.events.map((e, k) => ({
      fitId: fits[k]?.fitId ?? '',
      title: e.title,
      openingAngleDeg: e.openingAngleDeg,
      positionAngleDeg: e.positionAngleDeg,
    })),
    ambiguityResolved: fit.ambiguityResolved,
    alternativePole: { ...fit.alternative.pole, chi2: fit.alternative.chi2 },
  };
}
