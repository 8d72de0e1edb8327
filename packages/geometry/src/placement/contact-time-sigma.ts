// How uncertain a station's predicted contact times are, given the 1σ of the body–star offset: the ±
// that goes beside a predicted disappearance or reappearance in a briefing.
//
// The station moves on the sky plane relative to the body as p(t) = d·n + |v|(t − t*)·u, u = v/|v| and n
// = u turned +90° (the prediction's n_s, so d is its crossTrackKm). An error δ = (δf, δg) km of the body's
// place moves the station's track to p − δ, and the contacts with a circle of radius R come at
//   t = t* + [δ·u ∓ √(R² − (d − δ·n)²)] / |v|       (− disappearance, + reappearance).
// To first order, with L = √(R² − d²),
//   δt_D = (δ·u − (d/L)·δ·n) / |v|,   δt_R = (δ·u + (d/L)·δ·n) / |v|,
// and with δf, δg independent, σ = D·σ_raCosDec and D·σ_dec (D the body's distance, σ in radians),
//   σ_t² = [Var(δ·u) ∓ 2(d/L)·Cov(δ·u, δ·n) + (d/L)²·Var(δ·n)] / |v|²
// (first-order propagation with covariance: Taylor, An Introduction to Error Analysis, 2nd ed., 1997,
// sec. 9.2). The first term is the shift along the track (both contacts move together), the last the shift
// across it, which lengthens or shortens the chord; near the limb (L → 0) the second grows without bound,
// which is the honest answer for a grazing station: whether it sees the body at all is then in doubt.

export interface ContactTimeSigmaInput {
  /** The station's signed cross-track offset (the prediction's crossTrackKm), km. */
  crossTrackKm: number;
  /** Radius of the circle whose contacts are timed (the body's, or a ring's envelope), km. */
  radiusKm: number;
  /** The station's velocity on the sky plane relative to the body at t*, km/s (f east, g north). */
  velocityKmPerS: { f: number; g: number };
  /** 1σ of the body's place on the sky plane, km: D·σ_raCosDec along e_f, D·σ_dec along e_g. */
  sigmaFKm: number;
  sigmaGKm: number;
}

export interface ContactTimeSigma {
  /** 1σ of the first contact (disappearance, or a ring's entry), s. */
  firstSeconds: number;
  /** 1σ of the second contact (reappearance, or a ring's exit), s. */
  lastSeconds: number;
  /** 1σ of the time of closest approach alone (the shift along the track), s. */
  alongTrackSeconds: number;
}

/** σ of the two contact times of a station whose track crosses the circle (|crossTrackKm| < radiusKm). */
export function contactTimeSigma(input: ContactTimeSigmaInput): ContactTimeSigma {
  const speed = Math.hypot(input.velocityKmPerS.f, input.velocityKmPerS.g);
  if (!(speed > 0)) throw new RangeError('the station does not move on the sky plane; no contact time');
  if (!(input.sigmaFKm >= 0 && input.sigmaGKm >= 0))
    throw new RangeError('offset uncertainties must not be negative');
  const d = input.crossTrackKm;
  if (!(Math.abs(d) < input.radiusKm))
    throw new RangeError(
      `the track at ${d} km does not cross a circle of radius ${input.radiusKm} km; it has no contacts`,
    );
  const uf = input.velocityKmPerS.f / speed;
  const ug = input.velocityKmPerS.g / speed;
  const nf = -ug;
  const ng = uf;
  const a2 = input.sigmaFKm ** 2;
  const b2 = input.sigmaGKm ** 2;
  const varAlong = a2 * uf * uf + b2 * ug * ug;
  const varAcross = a2 * nf * nf + b2 * ng * ng;
  const cov = a2 * uf * nf + b2 * ug * ng;
  const k = d / Math.sqrt(input.radiusKm ** 2 - d * d);
  const sigma = (sign: number) =>
    Math.sqrt(Math.max(0, varAlong + sign * 2 * k * cov + k * k * varAcross)) / speed;
  return { firstSeconds: sigma(-1), lastSeconds: sigma(1), alongTrackSeconds: Math.sqrt(varAlong) / speed };
}
