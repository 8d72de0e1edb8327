import type { ContextResult, RingFit } from '../api/dynamics-schema';

export interface StripMark {
  key: string;
  kind: 'body' | 'roche' | 'synchronous' | 'spin-orbit' | 'mean-motion' | 'ring';
  label: string;
  radiusKm: number;
  /** 1-sigma in km; 0 when the mark has none worth drawing. */
  sigmaKm: number;
}

/**
 * Everything the strip shows, from the body outwards. The Hill radius is left to the table: it lies
 * hundreds of body radii out and would squeeze every other mark into a corner of the chart.
 */
export function stripMarks(result: ContextResult, bodyRadiusKm: number, ringFits: RingFit[]): StripMark[] {
  const u = result.uncertainty;
  const marks: StripMark[] = [
    { key: 'body', kind: 'body', label: 'Body radius', radiusKm: bodyRadiusKm, sigmaKm: 0 },
    {
      key: 'roche-fluid',
      kind: 'roche',
      label: 'Roche, fluid',
      radiusKm: result.rocheFluidKm,
      sigmaKm: u.rocheFluidKm,
    },
    {
      key: 'roche-rigid',
      kind: 'roche',
      label: 'Roche, rigid',
      radiusKm: result.rocheRigidKm,
      sigmaKm: u.rocheRigidKm,
    },
    {
      key: 'synchronous',
      kind: 'synchronous',
      label: 'Synchronous orbit',
      radiusKm: result.synchronousKm,
      sigmaKm: u.synchronousKm,
    },
    ...result.spinOrbit.map((s, i) => ({
      key: `spin-orbit-${s.k}`,
      kind: 'spin-orbit' as const,
      label: `1:${s.k} spin–orbit`,
      radiusKm: s.radiusKm,
      sigmaKm: u.spinOrbit[i]?.radiusKm ?? 0,
    })),
    ...result.meanMotion.map((m, i) => ({
      key: `mean-motion-${m.satellite}-${m.p}-${m.q}`,
      kind: 'mean-motion' as const,
      label: `${m.p}:${m.q} with ${m.satellite}`,
      radiusKm: m.radiusKm,
      sigmaKm: u.meanMotion[i]?.radiusKm ?? 0,
    })),
    ...ringFits.map((r) => ({
      key: `ring-${r.ring}`,
      kind: 'ring' as const,
      label: `Ring ${r.ring} (fit)`,
      radiusKm: r.radiusKm,
      sigmaKm: r.radiusKmSigma,
    })),
  ];
  return marks;
}

/** The strip runs from the centre to a little beyond the outermost ring, Roche limit or synchronous orbit. */
export function stripExtentKm(marks: StripMark[]): number {
  const anchors = marks.filter((m) => m.kind !== 'mean-motion' && m.kind !== 'spin-orbit');
  return 1.25 * Math.max(...anchors.map((m) => m.radiusKm + m.sigmaKm));
}
