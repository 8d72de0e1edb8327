// How the planning views write predicted numbers: each with its unit, and with its 1σ where it has one,
// rounded as the desk rounds fitted values (src/lib/value-sigma.ts).
import { decimalsForSigma, formatValueSigma } from '@/lib/value-sigma';

/** A UTC instant to `decimals` decimals of a second: "2029-09-07 21:32:55.6 UTC". */
export function utcAt(iso: string, decimals = 0): string {
  const ms = Date.parse(iso);
  if (Number.isNaN(ms)) return iso;
  // Rounded, not cut: 21:32:55.96 to one decimal is 21:32:56.0.
  const step = 10 ** (3 - Math.min(3, decimals));
  const text = new Date(Math.round(ms / step) * step).toISOString();
  const seconds = decimals > 0 ? text.slice(0, 20 + Math.min(3, decimals)) : text.slice(0, 19);
  return `${seconds.replace('T', ' ')} UTC`;
}

/** A predicted contact with the ± its 1σ implies: "2029-09-07 21:32:55.60 UTC ± 0.45 s". */
export function predictedTimeText(mark: { timeUtc: string; sigmaSeconds: number } | null): string {
  if (mark === null) return '—';
  const decimals = Math.min(3, decimalsForSigma(mark.sigmaSeconds));
  return `${utcAt(mark.timeUtc, decimals)} ± ${mark.sigmaSeconds.toFixed(decimals)} s`;
}

/** A time window "2029-09-07 21:32:44 – 21:33:19 UTC" (the second date only when it differs). */
export function windowText(fromUtc: string, toUtc: string): string {
  const from = utcAt(fromUtc);
  const to = utcAt(toUtc);
  return from.slice(0, 10) === to.slice(0, 10)
    ? `${from.replace(' UTC', '')} – ${to.slice(11)}`
    : `${from.replace(' UTC', '')} – ${to}`;
}

/** A signed cross-track offset with its 1σ: "+42 ± 20 km" (positive: left of the body's centre). */
export function crossTrackText(valueKm: number, sigmaKm: number): string {
  const text = formatValueSigma(Math.abs(valueKm), sigmaKm);
  return `${valueKm > 0 ? '+' : valueKm < 0 ? '−' : ''}${text} km`;
}

/** An angle in degrees to 0.1°: "48.3°". */
export function degText(valueDeg: number): string {
  return `${valueDeg.toFixed(1)}°`;
}
