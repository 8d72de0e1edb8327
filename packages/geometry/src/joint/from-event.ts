// From one validated event to what the joint pole fit needs: its sky-plane triad at its own reference
// time, the crossings of one ring there, and the centre the ring is held to (the event's limb centre,
// or none when the event has no positive chord or asks for a free ring centre, as the single-event fit).
// An event that asks for a joint limb and ring centre is held at its limb fit's centre too: its own ring
// dips belong to the pole fit here, and are not used a second time to place the centre.

import { fitLimb } from '../fit/limb-fit.js';
import { projectEvent } from '../project.js';
import { DEFAULT_SEED } from '../solve.js';
import { GeometryInputError, type EventInput, type SkyPointKm } from '../types.js';
import type { JointEvent } from './joint-fit.js';

/** The ring labels of an event, in the order their first dip appears. */
export function ringLabels(event: EventInput): string[] {
  return [...new Set(event.ringEvents.map((r) => r.ring))];
}

/**
 * The event as one term of the joint fit. `errorPath` (e.g. the file name) is what a refusal names: an
 * event without dips of the ring is refused before any fitting is done.
 */
export function jointEventFromInput(event: EventInput, ring: string, errorPath: string): JointEvent {
  if (!event.ringEvents.some((r) => r.ring === ring)) {
    const labels = ringLabels(event);
    throw new GeometryInputError(
      errorPath,
      `no dips of ring "${ring}" in this event` +
        (labels.length > 0
          ? ` (its rings: ${labels.map((l) => `"${l}"`).join(', ')})`
          : ' (it has no ring events)'),
    );
  }
  let projected = projectEvent(event);
  let center: SkyPointKm | null = null;
  const hasPositive = event.chords.some((c) => c.type === 'positive');
  if (hasPositive && event.fit.ring.centerFrom !== 'free') {
    const limb = fitLimb({
      points: projected.limbPoints,
      negatives: projected.negatives,
      fixed: event.fit.limb.fixed,
      modelErrorKm: event.fit.limb.modelErrorKm,
      fitTimeOffsets: event.fit.limb.fitTimeOffsets,
      seed: event.fit.seed ?? DEFAULT_SEED,
    });
    // Fitted clock offsets move the ring dips of the same stations too.
    if (limb.timeOffsets.length > 0)
      projected = projectEvent(event, {
        timeOffsetsSeconds: Object.fromEntries(limb.timeOffsets.map((o) => [o.station, o.seconds])),
      });
    center = { fKm: limb.ellipse.centerFKm, gKm: limb.ellipse.centerGKm };
  }
  return {
    title: event.title,
    triad: projected.basis,
    center,
    crossings: projected.ringPoints.get(ring) ?? [],
    errorPath,
  };
}
