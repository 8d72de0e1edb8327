// The ensemble sampler's diagnostics of a solution as table rows (docs/method.md, "Sampler diagnostics"):
// the acceptance fraction and, per sampled parameter, the integrated autocorrelation time and effective
// sample size, so that an exported 1-sigma travels with how well it was sampled. Absent for linearised
// (joint) fits and for solutions stored before the diagnostics.
import type { SamplerDiagnostics, Solution } from '@limbus/geometry';
import type { ParameterRow } from './table';

function rowsOf(group: string, d: SamplerDiagnostics): ParameterRow[] {
  const row = (parameter: string, value: number, unit = ''): ParameterRow => ({
    group,
    parameter,
    value,
    sigma: null,
    unit,
    status: 'derived',
  });
  return [
    row('acceptanceFraction', d.acceptanceFraction),
    row('walkers', d.walkers),
    row('steps', d.steps),
    ...d.parameters.flatMap((p) => [
      row(`autocorrelationSteps ${p.parameter}`, p.autocorrelationSteps),
      row(`effectiveSamples ${p.parameter}`, p.effectiveSamples),
    ]),
  ];
}

export function samplerRows(solution: Solution): ParameterRow[] {
  return [
    ...(solution.limb?.sampler ? rowsOf('sampler limb', solution.limb.sampler) : []),
    ...solution.rings.flatMap((r) => (r.sampler ? rowsOf(`sampler ring ${r.ring}`, r.sampler) : [])),
  ];
}
