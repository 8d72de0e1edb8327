import {
  Body1,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { Measured, RingSolution } from '@limbus/geometry';
import { ScrollArea } from '@/components/scroll-area';
import { formatValueSigma } from '@/lib/value-sigma';

const useStyles = makeStyles({
  number: { fontFamily: tokens.fontFamilyMonospace, textAlign: 'end', whiteSpace: 'nowrap' },
});

const valueSigma = (m: Measured | null | undefined): string =>
  m === null || m === undefined ? '—' : formatValueSigma(m.value, m.sigma);

/**
 * One ring's crossings as the fit gives them (docs/method.md, "Ring dips"): the radial width in the ring
 * plane ± 1σ, and where the dip's light curve gave its apparent opacity, the apparent and normal optical
 * depth (τ and τ·|sin B|), equivalent width and equivalent depth, each ± 1σ. A dip not resolved or opaque
 * gives lower limits, and the table says so.
 */
export function RingCrossingsTable({ ring }: { ring: RingSolution }) {
  const styles = useStyles();
  if (ring.crossings.length === 0) return null;
  const withDip = ring.crossings.some((c) => c.dip !== undefined);
  const limited = ring.crossings.filter((c) => c.dip?.lowerLimit === true).map((c) => c.station);
  return (
    <>
      <ScrollArea label={`Crossings of ring ${ring.ring} table`}>
        <Table aria-label={`Crossings of ring ${ring.ring}`} size="small">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Station</TableHeaderCell>
              <TableHeaderCell>Radial width ± 1σ (km)</TableHeaderCell>
              <TableHeaderCell>Apparent opacity</TableHeaderCell>
              <TableHeaderCell>τ apparent</TableHeaderCell>
              <TableHeaderCell>τ normal</TableHeaderCell>
              <TableHeaderCell>Equivalent width, apparent / normal (km)</TableHeaderCell>
              <TableHeaderCell>Equivalent depth, apparent / normal (km)</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {ring.crossings.map((c, k) => (
              <TableRow key={`${c.station}-${k}`}>
                <TableCell>
                  {c.station}
                  {c.dip?.lowerLimit ? ' (lower limits)' : ''}
                </TableCell>
                <TableCell className={styles.number}>
                  {c.radialWidthKmSigma === undefined
                    ? c.radialWidthKm.toFixed(2)
                    : formatValueSigma(c.radialWidthKm, c.radialWidthKmSigma)}
                </TableCell>
                <TableCell className={styles.number}>{valueSigma(c.dip?.apparentOpacity)}</TableCell>
                <TableCell className={styles.number}>
                  {c.dip !== undefined && c.dip.apparentOpticalDepth === null
                    ? 'opaque'
                    : valueSigma(c.dip?.apparentOpticalDepth)}
                </TableCell>
                <TableCell className={styles.number}>{valueSigma(c.dip?.normalOpticalDepth)}</TableCell>
                <TableCell className={styles.number}>
                  {c.dip === undefined
                    ? '—'
                    : `${valueSigma(c.dip.equivalentWidthKm)} / ${valueSigma(c.dip.normalEquivalentWidthKm)}`}
                </TableCell>
                <TableCell className={styles.number}>
                  {c.dip === undefined
                    ? '—'
                    : `${valueSigma(c.dip.equivalentDepthKm)} / ${valueSigma(c.dip.normalEquivalentDepthKm)}`}
                </TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      </ScrollArea>
      <Body1 as="p">
        {withDip
          ? 'Normal values take the ring’s opening angle B (τ·|sin B|, width and depth in the ring plane); a dip timed without its light curve’s depth gives its radial width only.'
          : 'No dip of this ring carries its light curve’s depth: make the ring events from a timing’s dips to get optical depths and equivalent widths.'}
        {limited.length > 0
          ? ` At ${limited.join(', ')} the dip was not resolved (narrower than the Fresnel scale, the star or one exposure) or was opaque: those values only bound the ring from below.`
          : ''}
      </Body1>
    </>
  );
}
