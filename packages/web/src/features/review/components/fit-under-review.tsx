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
import type { Solution } from '@limbus/geometry';
import { LIMB_PARAMETERS, readFitOptions, RING_CENTER_WORDS } from '@/lib/fit-numbers';
import { formatValueSigma } from '@/lib/value-sigma';

const useStyles = makeStyles({
  number: { fontFamily: tokens.fontFamilyMonospace, textAlign: 'end', whiteSpace: 'nowrap' },
  options: { margin: 0, paddingLeft: tokens.spacingHorizontalL },
});

interface NumberRow {
  label: string;
  value: string;
  unit: string;
}

/** Every number a reviewer weighs, each fitted one with its 1σ, in the order a paper quotes them. */
function rowsOf(solution: Solution, fixed: Partial<Record<string, number>>): NumberRow[] {
  const rows: NumberRow[] = [];
  const limb = solution.limb;
  if (limb !== null) {
    for (const p of LIMB_PARAMETERS) {
      const held = fixed[p.key];
      rows.push({
        label: p.label,
        value:
          held === undefined
            ? formatValueSigma(limb[p.key], limb.uncertainty[p.key])
            : `${limb[p.key].toFixed(p.decimals)} (fixed)`,
        unit: p.unit,
      });
    }
    rows.push({
      label: 'χ²/dof',
      value:
        limb.dof > 0
          ? `${limb.chi2.toFixed(2)} / ${limb.dof} = ${(limb.chi2 / limb.dof).toFixed(2)}`
          : `${limb.chi2.toFixed(2)} / 0 (no degrees of freedom)`,
      unit: '',
    });
    for (const t of limb.timeOffsets)
      rows.push({
        label: `Clock offset, ${t.station}`,
        value: formatValueSigma(t.seconds, t.sigma),
        unit: 's',
      });
  }
  for (const ring of solution.rings) {
    rows.push({
      label: `Ring ${ring.ring} radius`,
      value: formatValueSigma(ring.radiusKm, ring.uncertainty.radiusKm),
      unit: 'km',
    });
    rows.push({
      label: `Ring ${ring.ring} opening angle`,
      value: formatValueSigma(ring.openingAngleDeg, ring.uncertainty.openingAngleDeg),
      unit: '°',
    });
    rows.push({
      label: `Ring ${ring.ring} position angle`,
      value: formatValueSigma(ring.positionAngleDeg, ring.uncertainty.positionAngleDeg),
      unit: '°',
    });
  }
  const astrometry = solution.astrometry;
  if (astrometry !== null) {
    rows.push({
      label: 'Astrometric offset Δα cos δ',
      value: formatValueSigma(astrometry.raOffsetCosDecMas, astrometry.uncertainty.raOffsetCosDecMas),
      unit: 'mas',
    });
    rows.push({
      label: 'Astrometric offset Δδ',
      value: formatValueSigma(astrometry.decOffsetMas, astrometry.uncertainty.decOffsetMas),
      unit: 'mas',
    });
  }
  return rows;
}

/** The options in words; a fit stores only what its request named, the rest came from the event. */
function optionLines(solution: Solution, options: Record<string, unknown> | undefined): string[] {
  const read = readFitOptions(options);
  const fixed = read.fixed;
  const held =
    fixed === null
      ? "the event's defaults"
      : LIMB_PARAMETERS.flatMap((p) => {
          const value = fixed[p.key];
          return value === undefined ? [] : [`${p.label} = ${value}${p.unit === '' ? '' : ` ${p.unit}`}`];
        }).join(', ') || 'nothing (every limb parameter fitted)';
  const clocks = read.fitTimeOffsets ?? solution.limb?.timeOffsets.map((t) => t.station) ?? [];
  return [
    `Held fixed: ${held}`,
    `Model error: ${read.modelErrorKm === null ? "the event's default" : `${read.modelErrorKm} km`}`,
    `Clock offsets fitted for: ${clocks.length === 0 ? 'no station' : clocks.join(', ')}`,
    `Ring centres: ${read.ringCenterFrom === null ? "the event's default" : RING_CENTER_WORDS[read.ringCenterFrom]}`,
  ];
}

/** What the fit under review says, and what it was asked to do. */
export function FitUnderReview({
  solution,
  options,
}: {
  solution: Solution;
  options: Record<string, unknown> | undefined;
}) {
  const styles = useStyles();
  const rows = rowsOf(solution, readFitOptions(options).fixed ?? {});
  return (
    <>
      {solution.limb === null ? <Body1 as="p">This fit has no limb (no positive chords).</Body1> : null}
      {rows.length > 0 ? (
        <Table aria-label="Numbers of the fit under review" size="small">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Quantity</TableHeaderCell>
              <TableHeaderCell>Value ± 1σ</TableHeaderCell>
              <TableHeaderCell>Unit</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {rows.map((row) => (
              <TableRow key={row.label}>
                <TableCell>{row.label}</TableCell>
                <TableCell className={styles.number}>{row.value}</TableCell>
                <TableCell>{row.unit === '' ? '—' : row.unit}</TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      ) : null}
      <ul className={styles.options} aria-label="Options of the fit under review">
        {optionLines(solution, options).map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </>
  );
}
