import {
  Body1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
} from '@fluentui/react-components';
import type { ResonanceNearRing } from '../api/dynamics-schema';
import { ScrollArea } from '@/components/scroll-area';
import { formatValueSigma } from '@/lib/value-sigma';

export interface RingNearResonances {
  key: string;
  /** The event whose fit the ring comes from; null for a ring of the context file itself. */
  event: string | null;
  ring: string;
  radiusKm: number;
  radiusKmSigma: number;
  nearest: ResonanceNearRing[];
}

/** "6:1 with Oru", "1:3 spin–orbit" (a particle period of 3 spin periods), "synchronous orbit". */
export function resonanceName(r: Pick<ResonanceNearRing, 'kind' | 'satellite' | 'p' | 'q'>): string {
  if (r.kind === 'mean-motion') return `${r.p}:${r.q} with ${r.satellite ?? ''}`;
  return r.p === 1 && r.q === 1 ? 'synchronous orbit' : `${r.p}:${r.q} spin–orbit`;
}

const sigmas = (x: number | null): string => (x === null ? '—' : `${x.toFixed(1)}σ`);

/**
 * Each ring's nearest resonances: where the resonance lies (± its 1σ from the mass, period and orbit), how
 * far the ring is from it (+ outside) with the 1σ of that distance, and the distance in units of the ring
 * radius's, the resonance's and their combined 1σ.
 */
export function NearestResonances({ rings, showEvent }: { rings: RingNearResonances[]; showEvent: boolean }) {
  if (rings.every((r) => r.nearest.length === 0)) return null;
  return (
    <>
      <ScrollArea label="Nearest resonances table">
        <Table aria-label="Nearest resonances of each ring" size="small">
          <TableHeader>
            <TableRow>
              {showEvent ? <TableHeaderCell>Event</TableHeaderCell> : null}
              <TableHeaderCell>Ring (km)</TableHeaderCell>
              <TableHeaderCell>Resonance</TableHeaderCell>
              <TableHeaderCell>At (km)</TableHeaderCell>
              <TableHeaderCell>Ring − resonance (km)</TableHeaderCell>
              <TableHeaderCell>In ring σ</TableHeaderCell>
              <TableHeaderCell>In resonance σ</TableHeaderCell>
              <TableHeaderCell>In combined σ</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {rings.flatMap((r) =>
              r.nearest.map((n, k) => (
                <TableRow key={`${r.key}-${n.kind}-${n.satellite ?? ''}-${n.p}-${n.q}`}>
                  {showEvent ? <TableCell>{k === 0 ? (r.event ?? 'context file') : ''}</TableCell> : null}
                  <TableCell>
                    {k === 0 ? `${r.ring}: ${formatValueSigma(r.radiusKm, r.radiusKmSigma)}` : ''}
                  </TableCell>
                  <TableCell>{resonanceName(n)}</TableCell>
                  <TableCell>{formatValueSigma(n.radiusKm, n.radiusKmSigma)}</TableCell>
                  <TableCell>{formatValueSigma(n.distanceKm, n.distanceKmSigma)}</TableCell>
                  <TableCell>{sigmas(n.distanceInRingSigma)}</TableCell>
                  <TableCell>{sigmas(n.distanceInResonanceSigma)}</TableCell>
                  <TableCell>{sigmas(n.distanceInSigma)}</TableCell>
                </TableRow>
              )),
            )}
          </TableBody>
        </Table>
      </ScrollArea>
      <Body1 as="p">
        Resonance radii are Keplerian (no J2, which moves real resonances outward by up to about a per cent);
        a ring within a few σ of a resonance is near it, not shown to be in it. σ of a distance carries the
        ring radius&apos;s 1σ and the resonance&apos;s (mass, period and orbit errors), taken as independent.
      </Body1>
    </>
  );
}
