// The joint ring pole of several stored fits: the same geometry functions as `limbus joint`
// (tools/cli/src/commands/joint.ts), fed with each fit's frozen input instead of a file, so a queued job
// and the command give the same document for the same events.
import {
  fitJointPole,
  GeometryInputError,
  jointEventFromInput,
  jointPoleDocument,
  ringLabels,
  type EventInput,
  type JointEvent,
  type JointPoleDocument as GeometryJointPoleDocument,
} from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import type { FieldIssue } from '../common/domain-errors';

export interface JointFitInput {
  fitId: string;
  /** The fit's event file (limbus-event/1) exactly as stored. */
  input: string;
}

/** The `limbus-joint/1` document of `limbus joint`, with the fit each event came from. */
export interface JointPoleDocument extends Omit<GeometryJointPoleDocument, 'events'> {
  events: Array<GeometryJointPoleDocument['events'][number] & { fitId: string }>;
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
    const v = validateEventFile(JSON.parse(f.input), { stored: true });
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
  const document = jointPoleDocument(ring, fit);
  return {
    ...document,
    events: document.events.map((e, k) => ({ fitId: fits[k]?.fitId ?? '', ...e })),
  };
}
