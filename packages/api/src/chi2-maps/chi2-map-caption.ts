// The caption draft of a χ² map figure: what was mapped, what was re-optimised, the minimum, and the
// map's cautions, so that the figure in a draft carries its own reading.
import type { Chi2Map } from '@limbus/geometry';
import { axisLabel } from '../exports/chi2-map-figure-svg';

export function chi2MapCaption(eventTitle: string, map: Chi2Map): string {
  const whose =
    map.chi2Of === 'joint'
      ? 'the joint limb and ring fit (all points)'
      : map.chi2Of === 'ring'
        ? `ring ${map.ring ?? ''} (its dips)`
        : 'the limb (its chord ends)';
  const profiled =
    map.profiled.length === 0
      ? 'no other parameter left free'
      : `re-optimised at each point: ${map.profiled.join(', ')}`;
  return (
    `${eventTitle}: profile χ² of ${whose} over ${axisLabel(map.x)} and ${axisLabel(map.y)}, ` +
    `${map.x.values.length} × ${map.y.values.length} points (${profiled}). ` +
    `Minimum χ² = ${map.minChi2.toPrecision(4)} for ${map.dof} degrees of freedom; contours at Δχ² = ` +
    `${map.levels.map((l) => l.deltaChi2.toFixed(2)).join(', ')} (1σ, 2σ, 3σ for two parameters). ` +
    map.cautions.join(' ')
  );
}
