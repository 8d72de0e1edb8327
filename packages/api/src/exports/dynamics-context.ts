// The event's body context (stored by the dynamics module) set against this fit's rings, as table rows
// and a caption sentence, so an exported ring radius travels with its meaning in body radii and Roche limits.
import type { RingFitAgainstContext } from '../dynamics/dynamics-view';
import { formatValueSigma } from './number-format';
import type { ParameterRow } from './table';

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
        `${formatValueSigma(r.inRocheRigid, r.uncertainty.inRocheRigid)} of the rigid one (${side(r.inRocheRigid)}).`,
    )
    .join(' ');
}
