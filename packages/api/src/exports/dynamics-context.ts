// The event's body context (stored by the dynamics module) set against this fit's rings, as table rows
// and a caption sentence, so an exported ring radius travels with its meaning in body radii and Roche limits.
import type { ResonanceNearRing } from '@limbus/geometry';
import type { RingFitAgainstContext } from '../dynamics/dynamics-view';
import { formatValueSigma } from './number-format';
import type { ParameterRow } from './table';

/** "6:1 with Oru", "3:1 spin–orbit" (particle period 3 spin periods is 1:3), "synchronous orbit". */
export function resonanceName(r: Pick<ResonanceNearRing, 'kind' | 'satellite' | 'p' | 'q'>): string {
  if (r.kind === 'mean-motion') return `${r.p}:${r.q} with ${r.satellite ?? ''}`;
  return r.p === 1 && r.q === 1 ? 'synchronous orbit' : `${r.p}:${r.q} spin–orbit`;
}

export function dynamicsRows(rings: RingFitAgainstContext[]): ParameterRow[] {
  return rings.flatMap((r) => {
    const group = `ring ${r.ring} context`;
    const row = (parameter: string, value: number, sigma: number): ParameterRow => ({
      group,
      parameter,
      value,
      sigma,
      unit: '',
      status: 'derived',
    });
    return [
      row('radiusInBodyRadii', r.inBodyRadii, r.uncertainty.inBodyRadii),
      row('radiusOverRocheFluid', r.inRocheFluid, r.uncertainty.inRocheFluid),
      row('radiusOverRocheRigid', r.inRocheRigid, r.uncertainty.inRocheRigid),
      row('radiusOverSynchronous', r.inSynchronous, r.uncertainty.inSynchronous),
      // The nearest resonance: ring radius minus its radius, with both their 1-sigma.
      ...r.nearestResonances.slice(0, 1).map((n) => ({
        ...row(`distanceKm to ${resonanceName(n)}`, n.distanceKm, n.distanceKmSigma),
        unit: 'km',
      })),
    ];
  });
}

const side = (ratio: number) => (ratio < 1 ? 'inside' : 'outside');

export function dynamicsCaption(rings: RingFitAgainstContext[]): string {
  return rings
    .map(
      (r) =>
        `Against the body context stored for the event, ring ${r.ring} lies at ` +
        `${formatValueSigma(r.inBodyRadii, r.uncertainty.inBodyRadii)} body radii, ` +
        `${formatValueSigma(r.inRocheFluid, r.uncertainty.inRocheFluid)} of the fluid Roche limit (${side(r.inRocheFluid)}) and ` +
        `${formatValueSigma(r.inRocheRigid, r.uncertainty.inRocheRigid)} of the rigid one (${side(r.inRocheRigid)}).` +
        nearestSentence(r.nearestResonances[0]),
    )
    .join(' ');
}

function nearestSentence(n: ResonanceNearRing | undefined): string {
  if (!n) return '';
  const where = n.distanceKm < 0 ? 'inside' : 'outside';
  const sigmas = n.distanceInSigma === null ? '' : ` (${Math.abs(n.distanceInSigma).toFixed(1)}σ)`;
  return (
    ` Its nearest resonance is the ${resonanceName(n)} at ${formatValueSigma(n.radiusKm, n.radiusKmSigma)} km, ` +
    `${formatValueSigma(Math.abs(n.distanceKm), n.distanceKmSigma)} km ${where} it${sigmas}.`
  );
}
