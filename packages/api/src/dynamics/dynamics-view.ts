// Step in the data flow: stored context input (+ the latest solved ring fit) -> geometry
// computeDynamicsContext -> the limbus-context/1 document and each fitted ring radius set against it.
import {
  computeDynamicsContext,
  type ContextResult,
  type ResonanceNearRing,
  type RingSolution,
} from '@limbus/geometry';
import { contextSources, type ContextInputFile, validateContextInput } from '@limbus/schema';

export const CONTEXT_OUTPUT_FORMAT = 'limbus-context/1';

/** The same assumptions `limbus context` prints (tools/cli/src/commands/context.ts). */
export const CONTEXT_NOTES = [
  'Roche limits use the bulk density of a sphere of radiusKm and the classical coefficients 2.44 (fluid) and 2^(1/3) ≈ 1.26 (rigid).',
  "Resonance and synchronous radii are Keplerian (point-mass body, no J2); a body's J2 moves real resonances outward by up to about a per cent.",
  "Each ring's nearest resonances include the k:1 and 1:k ones up to 8 and every p:q named in the input; a ring within a few sigma of one is near it, not shown to be in it.",
  'The Hill radius takes a circular orbit at the present heliocentric distance.',
  '1-sigma by first-order propagation of the inputs taken as independent.',
];

export interface ContextOutput extends ContextResult {
  format: typeof CONTEXT_OUTPUT_FORMAT;
  sources: Record<string, string>;
  notes: string[];
}

export interface RingFitAgainstContext {
  fitId: string;
  ring: string;
  radiusKm: number;
  radiusKmSigma: number;
  inBodyRadii: number;
  inRocheFluid: number;
  inRocheRigid: number;
  inSynchronous: number;
  uncertainty: { inBodyRadii: number; inRocheFluid: number; inRocheRigid: number; inSynchronous: number };
  /** The fitted radius's nearest resonances, its 1-sigma and the context's carried into the distances. */
  nearestResonances: ResonanceNearRing[];
}

export function contextOutput(file: ContextInputFile): ContextOutput {
  const validation = validateContextInput(file);
  if (!validation.ok) throw new Error('a stored context input no longer validates');
  const { uncertainty, ...figures } = computeDynamicsContext(validation.input);
  return {
    format: CONTEXT_OUTPUT_FORMAT,
    ...figures,
    sources: contextSources(file),
    notes: CONTEXT_NOTES,
    uncertainty,
  };
}

/**
 * The fitted rings are put through the same computation in place of the file's own rings, so their
 * ratios carry the context's propagated 1-sigma together with the fit's radius 1-sigma.
 */
export function ringFitsAgainst(
  file: ContextInputFile,
  fit: { id: string; rings: RingSolution[] },
): RingFitAgainstContext[] {
  if (fit.rings.length === 0) return [];
  const withFit: ContextInputFile = {
    ...file,
    rings: fit.rings.map((r) => ({
      ring: r.ring,
      radiusKm: r.radiusKm,
      radiusKmSigma: r.uncertainty.radiusKm,
    })),
  };
  const validation = validateContextInput(withFit);
  if (!validation.ok) return [];
  const result = computeDynamicsContext(validation.input);
  return result.ringRadii.map((r, i) => {
    const sigma = result.uncertainty.ringRadii[i];
    return {
      fitId: fit.id,
      ring: r.ring,
      radiusKm: r.radiusKm,
      radiusKmSigma: sigma?.radiusKm ?? 0,
      inBodyRadii: r.inBodyRadii,
      inRocheFluid: r.inRocheFluid,
      inRocheRigid: r.inRocheRigid,
      inSynchronous: r.inSynchronous,
      uncertainty: {
        inBodyRadii: sigma?.inBodyRadii ?? 0,
        inRocheFluid: sigma?.inRocheFluid ?? 0,
        inRocheRigid: sigma?.inRocheRigid ?? 0,
        inSynchronous: sigma?.inSynchronous ?? 0,
      },
      nearestResonances: result.ringResonances[i]?.nearest ?? [],
    };
  });
}
