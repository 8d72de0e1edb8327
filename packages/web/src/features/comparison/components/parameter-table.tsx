import {
  Checkbox,
  makeStyles,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { ComparisonFit, ValueSigma } from '../api/get-comparison';
import { fitColour } from '../format';
import { ScrollArea } from '@/components/scroll-area';
import { StaleFitBadge } from '@/components/stale-fit';
import { utcText } from '@/lib/utc-text';
import { formatValueSigma } from '@/lib/value-sigma';

const useStyles = makeStyles({
  // Fluent's table is fixed-layout; these columns must grow to their numbers instead of overlapping.
  table: { tableLayout: 'auto', width: 'max-content', minWidth: '100%' },
  number: { fontFamily: tokens.fontFamilyMonospace, textAlign: 'end', whiteSpace: 'nowrap' },
  swatch: { display: 'inline-block', width: '10px', height: '10px', marginRight: tokens.spacingHorizontalXS },
});

function Cell({ v }: { v: ValueSigma | undefined }) {
  const styles = useStyles();
  return (
    <TableCell className={styles.number}>
      {v === undefined ? '—' : formatValueSigma(v.value, v.sigma)}
    </TableCell>
  );
}

/** A pole's RA and Dec, each ± 1σ where the fit has them (fits stored before pole 1σ show the values). */
function PoleCell({ pole }: { pole: ComparisonFit['rings'][number]['poles'][number] | undefined }) {
  const styles = useStyles();
  if (pole === undefined) return <TableCell className={styles.number}>—</TableCell>;
  const u = pole.uncertainty;
  return (
    <TableCell className={styles.number}>
      {u === null || u === undefined
        ? `${pole.raDeg.toFixed(2)}, ${pole.decDeg.toFixed(2)}`
        : `${formatValueSigma(pole.raDeg, u.raDeg)}, ${formatValueSigma(pole.decDeg, u.decDeg)} (ρ ${u.correlation.toFixed(2)})`}
    </TableCell>
  );
}

export interface ParameterTableProps {
  fits: ComparisonFit[];
  ringLabels: string[];
  selected: ReadonlySet<string>;
  onToggle: (fitId: string) => void;
}

/** Every limb and ring parameter of each fit, ± 1σ, against the event date. */
export function ParameterTable({ fits, ringLabels, selected, onToggle }: ParameterTableProps) {
  const styles = useStyles();
  return (
    <ScrollArea label="Comparison table">
      <Table className={styles.table} aria-label="Parameters by event" size="small">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Joint pole</TableHeaderCell>
            <TableHeaderCell>Event date (UTC)</TableHeaderCell>
            <TableHeaderCell>Event</TableHeaderCell>
            <TableHeaderCell>Review</TableHeaderCell>
            <TableHeaderCell>Equatorial radius (km)</TableHeaderCell>
            <TableHeaderCell>Oblateness</TableHeaderCell>
            <TableHeaderCell>Limb position angle (°)</TableHeaderCell>
            <TableHeaderCell>Equivalent radius (km)</TableHeaderCell>
            <TableHeaderCell>Centre f (km)</TableHeaderCell>
            <TableHeaderCell>Centre g (km)</TableHeaderCell>
            {ringLabels.flatMap((label) => [
              <TableHeaderCell key={`${label}-r`}>Ring {label} radius (km)</TableHeaderCell>,
              <TableHeaderCell key={`${label}-b`}>Ring {label} opening angle (°)</TableHeaderCell>,
              <TableHeaderCell key={`${label}-p`}>Ring {label} position angle (°)</TableHeaderCell>,
              <TableHeaderCell key={`${label}-pole1`}>Ring {label} pole 1: RA, Dec (°)</TableHeaderCell>,
              <TableHeaderCell key={`${label}-pole2`}>Ring {label} pole 2: RA, Dec (°)</TableHeaderCell>,
            ])}
          </TableRow>
        </TableHeader>
        <TableBody>
          {fits.map((fit, i) => {
            const limb = fit.limb;
            return (
              <TableRow key={fit.fitId} data-fit={fit.fitId}>
                <TableCell>
                  <Checkbox
                    checked={selected.has(fit.fitId)}
                    disabled={fit.rings.length === 0}
                    onChange={() => onToggle(fit.fitId)}
                    aria-label={`Use ${fit.eventTitle} in the joint pole`}
                  />
                </TableCell>
                <TableCell>{fit.eventDateUtc === null ? '—' : utcText(fit.eventDateUtc)}</TableCell>
                <TableCell>
                  <span className={styles.swatch} style={{ background: fitColour(i) }} aria-hidden />
                  {fit.eventTitle}
                  {fit.inputMatchesEvent === false ? (
                    <>
                      {' '}
                      <StaleFitBadge />
                    </>
                  ) : null}
                </TableCell>
                <TableCell>{fit.reviewState === 'approved' ? 'approved' : 'not approved'}</TableCell>
                <Cell v={limb?.equatorialRadiusKm} />
                <Cell v={limb?.oblateness} />
                <Cell v={limb?.positionAngleDeg} />
                <Cell v={limb?.equivalentRadiusKm} />
                <Cell v={limb?.centerFKm} />
                <Cell v={limb?.centerGKm} />
                {ringLabels.flatMap((label) => {
                  const ring = fit.rings.find((r) => r.ring === label);
                  return [
                    <Cell key={`${label}-r`} v={ring?.radiusKm} />,
                    <Cell key={`${label}-b`} v={ring?.openingAngleDeg} />,
                    <Cell key={`${label}-p`} v={ring?.positionAngleDeg} />,
                    <PoleCell key={`${label}-pole1`} pole={ring?.poles[0]} />,
                    <PoleCell key={`${label}-pole2`} pole={ring?.poles[1]} />,
                  ];
                })}
              </TableRow>
            );
          })}
        </TableBody>
      </Table>
    </ScrollArea>
  );
}
