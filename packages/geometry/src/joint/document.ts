// The "limbus-joint/1" document (docs/file-formats.md, "Joint pole") made from a joint pole fit: one
// builder for `limbus joint` and the server's joint-pole job, so both print the same fields.
import type { JointPoleFit } from './joint-fit.js';

export const JOINT_FORMAT = 'limbus-joint/1';

export interface JointPoleDocument {
  format: typeof JOINT_FORMAT;
  ring: string;
  pole: { raDeg: number; decDeg: number };
  /** 1-sigma (scaled by sigmaScale), RA in degrees of RA; correlation of RA and Dec. */
  uncertainty: { raDeg: number; decDeg: number; correlation: number };
  radiusKm: number;
  radiusSigmaKm: number;
  chi2: number;
  dof: number;
  reducedChi2: number | null;
  sigmaScale: number;
  familyDeltaChi2: number;
  notes: string[];
  events: Array<{ title: string; openingAngleDeg: number; positionAngleDeg: number }>;
  ambiguityResolved: boolean;
  alternativePole: { raDeg: number; decDeg: number; chi2: number };
}

export function jointPoleDocument(ring: string, fit: JointPoleFit): JointPoleDocument {
  return {
    format: JOINT_FORMAT,
    ring,
    pole: fit.pole,
    uncertainty: { ...fit.uncertainty, correlation: fit.raDecCorrelation },
    radiusKm: fit.radiusKm,
    radiusSigmaKm: fit.radiusSigmaKm,
    chi2: fit.chi2,
    dof: fit.dof,
    reducedChi2: fit.reducedChi2,
    sigmaScale: fit.sigmaScale,
    familyDeltaChi2: fit.familyDeltaChi2,
    notes: fit.notes,
    events: fit.events.map((e) => ({
      title: e.title,
      openingAngleDeg: e.openingAngleDeg,
      positionAngleDeg: e.positionAngleDeg,
    })),
    ambiguityResolved: fit.ambiguityResolved,
    alternativePole: { ...fit.alternative.pole, chi2: fit.alternative.chi2 },
  };
}
