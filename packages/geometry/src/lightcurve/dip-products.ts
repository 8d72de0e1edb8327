// What a fitted dip says about the ring (or other matter) that made it, along the station's track in the
// sky plane: apparent opacity p, apparent optical depth τ = −ln(1 − p), the length L = v·(end − start)
// it covers, its equivalent width E = p·L and equivalent depth A = τ·L, each with a first-order 1-sigma
// from the covariance of (start, end, depth) (Taylor, An Introduction to Error Analysis, 2nd ed., §9.2).
// Definitions: τ = −ln T with T the transmitted fraction (PDS4 Rings data dictionary, "normal_optical_depth");
// equivalent depth = width × mean optical depth (Ellis et al., Planetary Ring Systems, Springer 2007, as
// quoted by the Observatoire de Paris astronomy dictionary); equivalent width = ∫ p dx (Elliot & Nicholson,
// "The rings of Uranus", in Planetary Rings, Univ. Arizona Press 1984 — from memory).
//
// A dip narrower than the smoothing of its edges (the Fresnel scale, the star's disc, the distance the
// shadow moves in one exposure) is not resolved: the curve fixes how much light it removed — E, since a
// smoothing kernel of unit area keeps the area of what it smooths — but not how that is shared between
// depth and width. Its opacity, optical depth and equivalent depth are then only bounded below, by a dip
// as wide as the smoothing: p ≥ E/ℓ, τ ≥ −ln(1 − E/ℓ), A ≥ τ·ℓ (A = −ln(1 − p)·E/p grows with p). An
// opaque dip (p = 1) has τ unbounded above; its 1-sigma lower bound is −ln(σp).

import { propagateCovariance } from '../fit/covariance.js';
import { DEG } from '../math.js';

/** What limits the resolution along the track, in km. */
export interface DipResolution {
  fresnelScaleKm: number;
  starDiameterKm: number;
  /** The distance the shadow moves in one exposure. */
  exposureKm: number;
}

/** Bounds from below that replace a dip's measured products when it is not resolved or is opaque. */
export interface DipLowerLimits {
  /** "narrower than the Fresnel scale", "... the star's disc", "... one exposure", or "opaque". */
  reason: string;
  apparentOpacity: number;
  apparentOpticalDepth: number;
  /** τ·|sin B|, when the ring's opening angle was given. */
  normalOpticalDepth: number | null;
  equivalentDepthKm: number;
}

/** A ring's opening angle B and its 1-sigma, degrees: what turns an apparent optical depth normal. */
export interface OpeningAngle {
  valueDeg: number;
  sigmaDeg: number;
}

export interface DipProducts {
  apparentOpacity: number;
  /** Null when the covariance of the fit could not be formed (a degenerate dip). */
  apparentOpacitySigma: number | null;
  /** −ln(1 − opacity); null when the dip is opaque. */
  apparentOpticalDepth: number | null;
  apparentOpticalDepthSigma: number | null;
  /** v·(end − start): the dip's length along the track in the sky plane. */
  widthKm: number;
  widthKmSigma: number | null;
  /** opacity × v × (end − start). */
  equivalentWidthKm: number;
  equivalentWidthKmSigma: number | null;
  /** optical depth × v × (end − start); null when the dip is opaque. */
  equivalentDepthKm: number | null;
  equivalentDepthKmSigma: number | null;
  /**
   * τ_N = τ·|sin B| with B the ring's opening angle, when it was given (PDS4 Rings data dictionary,
   * "normal_optical_depth"); its 1-sigma adds B's: σ² = (|sin B|·στ)² + (τ·cos B·σB)². Null without B or
   * when the dip is opaque.
   */
  normalOpticalDepth: number | null;
  normalOpticalDepthSigma: number | null;
  /** Null for a resolved dip that is not opaque: its products are measurements. */
  lowerLimits: DipLowerLimits | null;
}

/** Above this opacity a dip counts as opaque (its optical depth is not finite to double precision). */
const OPAQUE = 1 - 1e-9;

/**
 * The products of a dip fitted as (start, end, opacity) with covariance `cov` (rows start s, end s,
 * opacity; null when it could not be formed), seen at sky-plane speed v.
 */
export function dipProducts(
  fit: { startSeconds: number; endSeconds: number; opacity: number },
  cov: readonly number[][] | null,
  speedKmPerS: number,
  resolution: DipResolution,
  openingAngle?: OpeningAngle,
): DipProducts {
  const v = speedKmPerS;
  const p = fit.opacity;
  const widthKm = v * (fit.endSeconds - fit.startSeconds);
  const opaque = p >= OPAQUE;
  const tau = opaque ? null : -Math.log(1 - p);
  // Gradients with respect to (start, end, opacity).
  const rows: number[][] = [
    [0, 0, 1],
    [-v, v, 0],
    [-v * p, v * p, widthKm],
  ];
  if (tau !== null) rows.push([0, 0, 1 / (1 - p)], [-v * tau, v * tau, widthKm / (1 - p)]);
  const sigmas =
    cov === null ? null : propagateCovariance(cov, rows).map((r, i) => Math.sqrt(Math.max(0, r[i] ?? 0)));
  const sigma = (k: number): number | null => sigmas?.[k] ?? null;
  const equivalentWidthKm = p * widthKm;

  const reasons: string[] = [];
  if (widthKm < resolution.fresnelScaleKm) reasons.push('narrower than the Fresnel scale');
  if (widthKm < resolution.starDiameterKm) reasons.push("narrower than the star's disc");
  if (widthKm < resolution.exposureKm) reasons.push('narrower than one exposure');
  const sinB = openingAngle === undefined ? null : Math.abs(Math.sin(openingAngle.valueDeg * DEG));
  const normal = (t: number | null): number | null => (t === null || sinB === null ? null : t * sinB);
  let normalSigma: number | null = null;
  const sigmaTau = tau === null ? null : sigma(3);
  if (tau !== null && sigmaTau !== null && sinB !== null && openingAngle !== undefined)
    normalSigma = Math.hypot(
      sinB * sigmaTau,
      tau * Math.cos(openingAngle.valueDeg * DEG) * openingAngle.sigmaDeg * DEG,
    );
  let lowerLimits: DipLowerLimits | null = null;
  if (reasons.length > 0) {
    const smoothingKm = Math.max(resolution.fresnelScaleKm, resolution.starDiameterKm, resolution.exposureKm);
    const pMin = Math.min(equivalentWidthKm / smoothingKm, OPAQUE);
    const tauMin = -Math.log(1 - pMin);
    lowerLimits = {
      reason: reasons.join(', '),
      apparentOpacity: pMin,
      apparentOpticalDepth: tauMin,
      normalOpticalDepth: normal(tauMin),
      equivalentDepthKm: tauMin * smoothingKm,
    };
  } else if (opaque) {
    const sigmaP = sigma(0);
    const tauMin = sigmaP !== null && sigmaP > 0 && sigmaP < 1 ? -Math.log(sigmaP) : 0;
    lowerLimits = {
      reason: 'opaque',
      apparentOpacity: sigmaP === null ? p : Math.max(0, p - sigmaP),
      apparentOpticalDepth: tauMin,
      normalOpticalDepth: normal(tauMin),
      equivalentDepthKm: tauMin * widthKm,
    };
  }
  return {
    apparentOpacity: p,
    apparentOpacitySigma: sigma(0),
    apparentOpticalDepth: tau,
    apparentOpticalDepthSigma: tau === null ? null : sigma(3),
    widthKm,
    widthKmSigma: sigma(1),
    equivalentWidthKm,
    equivalentWidthKmSigma: sigma(2),
    equivalentDepthKm: tau === null ? null : tau * widthKm,
    equivalentDepthKmSigma: tau === null ? null : sigma(4),
    normalOpticalDepth: normal(tau),
    normalOpticalDepthSigma: normalSigma,
    lowerLimits,
  };
}
