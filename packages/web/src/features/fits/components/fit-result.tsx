import {
  Badge,
  Body1,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Subtitle2,
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
import { RingCrossingsTable } from './ring-crossings-table';

const useStyles = makeStyles({
  result: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  number: { fontFamily: tokens.fontFamilyMonospace, textAlign: 'end', whiteSpace: 'nowrap' },
});

/** A fit's numbers, each with its 1-σ, and what was fixed or assumed to get them. */
export function FitResult({
  solution,
  options,
}: {
  solution: Solution;
  options: Record<string, unknown> | undefined;
}) {
  const styles = useStyles();
  const limb = solution.limb;
  const read = readFitOptions(options);
  const fixed = read.fixed ?? {};
  const cautions = cautionsOf(solution, options);
  return (
    <div className={styles.result}>
      {limb === null ? (
        <Body1 as="p">This fit has no limb (no positive chords).</Body1>
      ) : (
        <>
          <Table aria-label="Limb parameters" size="small">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Parameter</TableHeaderCell>
                <TableHeaderCell>Value ± 1σ</TableHeaderCell>
                <TableHeaderCell>Unit</TableHeaderCell>
                <TableHeaderCell>Status</TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {LIMB_PARAMETERS.map((p) => (
                <TableRow key={p.key}>
                  <TableCell>{p.label}</TableCell>
                  <TableCell className={styles.number}>
                    {p.key in fixed
                      ? limb[p.key].toFixed(p.decimals)
                      : formatValueSigma(limb[p.key], limb.uncertainty[p.key])}
                  </TableCell>
                  <TableCell>{p.unit === '' ? '—' : p.unit}</TableCell>
                  <TableCell>{p.key in fixed ? 'fixed' : 'fitted'}</TableCell>
                </TableRow>
              ))}
              <TableRow>
                <TableCell>Equivalent radius</TableCell>
                <TableCell className={styles.number}>
                  {formatValueSigma(limb.equivalentRadiusKm, limb.uncertainty.equivalentRadiusKm)}
                </TableCell>
                <TableCell>km</TableCell>
                <TableCell>derived</TableCell>
              </TableRow>
              {limb.timeOffsets.map((t) => (
                <TableRow key={t.station}>
                  <TableCell>Clock offset, {t.station}</TableCell>
                  <TableCell className={styles.number}>{formatValueSigma(t.seconds, t.sigma)}</TableCell>
                  <TableCell>s</TableCell>
                  <TableCell>fitted</TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
          {/* A div, not a p: the badge is a div, which a paragraph may not hold. */}
          <div>
            <Body1>
              χ² = {limb.chi2.toFixed(2)} for {limb.dof} degrees of freedom
              {limb.dof > 0 ? ` (χ²/dof = ${(limb.chi2 / limb.dof).toFixed(2)})` : ''}.
            </Body1>{' '}
            <Badge
              appearance={limb.negativeChordsClear ? 'outline' : 'filled'}
              color={limb.negativeChordsClear ? 'success' : 'danger'}
            >
              {limb.negativeChordsClear
                ? 'every negative chord is clear of the limb'
                : 'a negative chord crosses the limb'}
            </Badge>
          </div>
        </>
      )}
      {solution.rings.map((ring) => {
        const from = ring.centerFrom ?? read.ringCenterFrom;
        const u = ring.uncertainty;
        const centre =
          u.centerFKm === undefined || u.centerGKm === undefined
            ? `f = ${ring.centerFKm.toFixed(2)} km, g = ${ring.centerGKm.toFixed(2)} km`
            : `f = ${formatValueSigma(ring.centerFKm, u.centerFKm)} km, g = ${formatValueSigma(ring.centerGKm, u.centerGKm)} km`;
        const poleSigmas = ring.poles.every((p) => p.uncertainty !== undefined);
        return (
          <section key={ring.ring} className={styles.result} aria-label={`Ring ${ring.ring}`}>
            <Subtitle2 as="h4">Ring {ring.ring}</Subtitle2>
            <Body1 as="p">
              Radius {formatValueSigma(ring.radiusKm, u.radiusKm)} km, opening angle{' '}
              {formatValueSigma(ring.openingAngleDeg, u.openingAngleDeg)}°, position angle{' '}
              {formatValueSigma(ring.positionAngleDeg, u.positionAngleDeg)}°; χ² {ring.chi2.toFixed(2)} for{' '}
              {ring.dof} dof.
            </Body1>
            <Body1 as="p" aria-label={`Centre of ring ${ring.ring}`}>
              Centre {centre}
              {from === null ? '' : `, ${RING_CENTER_WORDS[from]}`}.
            </Body1>
            <Table aria-label={`Pole solutions of ring ${ring.ring}`} size="small">
              <TableHeader>
                <TableRow>
                  <TableHeaderCell>Pole</TableHeaderCell>
                  <TableHeaderCell>RA ± 1σ (°)</TableHeaderCell>
                  <TableHeaderCell>Dec ± 1σ (°)</TableHeaderCell>
                  <TableHeaderCell>RA–Dec correlation</TableHeaderCell>
                </TableRow>
              </TableHeader>
              <TableBody>
                {ring.poles.map((pole, i) => (
                  <TableRow key={i}>
                    <TableCell>{i === 0 ? 'First' : 'Second'} solution</TableCell>
                    <TableCell className={styles.number}>
                      {pole.uncertainty === undefined
                        ? pole.raDeg.toFixed(2)
                        : formatValueSigma(pole.raDeg, pole.uncertainty.raDeg)}
                    </TableCell>
                    <TableCell className={styles.number}>
                      {pole.uncertainty === undefined
                        ? pole.decDeg.toFixed(2)
                        : formatValueSigma(pole.decDeg, pole.uncertainty.decDeg)}
                    </TableCell>
                    <TableCell className={styles.number}>
                      {pole.uncertainty === undefined ? '—' : pole.uncertainty.correlation.toFixed(2)}
                    </TableCell>
                  </TableRow>
                ))}
              </TableBody>
            </Table>
            {poleSigmas ? null : (
              <Body1 as="p">
                This fit was stored before pole 1σ were computed; run it again to get them.
              </Body1>
            )}
            <RingCrossingsTable ring={ring} />
          </section>
        );
      })}
      {solution.astrometry === null ? null : (
        <Body1 as="p" aria-label="Astrometric offset">
          Astrometric offset at {solution.astrometry.referenceTimeUtc}: Δα cos δ ={' '}
          {formatValueSigma(
            solution.astrometry.raOffsetCosDecMas,
            solution.astrometry.uncertainty.raOffsetCosDecMas,
          )}{' '}
          mas, Δδ ={' '}
          {formatValueSigma(solution.astrometry.decOffsetMas, solution.astrometry.uncertainty.decOffsetMas)}{' '}
          mas.
        </Body1>
      )}
      <MessageBar intent="warning" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>Cautions</MessageBarTitle>
          <ul aria-label="Cautions">
            {cautions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </MessageBarBody>
      </MessageBar>
      <Body1 as="p">
        Engine {solution.engine.version}, seed {solution.engine.seed}, input{' '}
        {solution.engine.inputSha256.slice(0, 12)}…
      </Body1>
    </div>
  );
}

/** What a reader must know before quoting the numbers: every fixed value and assumption, stated plainly. */
export function cautionsOf(solution: Solution, options: Record<string, unknown> | undefined): string[] {
  const read = readFitOptions(options);
  const fixed = read.fixed ?? {};
  const cautions: string[] = [];
  for (const p of LIMB_PARAMETERS) {
    const value = fixed[p.key];
    if (value !== undefined)
      cautions.push(
        `${p.label} was fixed at ${value}${p.unit === '' ? '' : ` ${p.unit}`}, not fitted; its 1σ is not meaningful.`,
      );
  }
  const limb = solution.limb;
  if (limb !== null) {
    const positives = solution.chords.filter((c) => c.type === 'positive').length;
    if (limb.dof <= 0)
      cautions.push(
        `No degrees of freedom are left (${positives} positive chords); the 1σ values rest on the sigmas alone.`,
      );
    if (!limb.negativeChordsClear)
      cautions.push('A negative chord crosses the fitted limb: the solution contradicts an observation.');
    if (limb.dof > 0 && limb.chi2 / limb.dof > 3)
      cautions.push(
        'χ²/dof is above 3: the timings scatter more than their sigmas allow (clock errors or topography?).',
      );
    if (limb.timeOffsets.length > 0)
      cautions.push(
        `Clock offsets were fitted for ${limb.timeOffsets.map((t) => t.station).join(', ')}; those chords fix the shape only.`,
      );
  }
  if (read.modelErrorKm !== null && read.modelErrorKm > 0)
    cautions.push(`A model error of ${read.modelErrorKm} km was added to every endpoint.`);
  const from = solution.rings[0]?.centerFrom ?? read.ringCenterFrom ?? 'limb';
  if (solution.rings.length > 0 && from === 'limb')
    cautions.push(
      "Ring centres were taken from the limb centre (assumed concentric); the rings' radius, opening angle and pole 1σ leave out the centre's own error (a joint fit carries it).",
    );
  if (solution.rings.length > 0 && from === 'joint')
    cautions.push(
      'The limb and the rings were fitted together about one shared centre (assumed concentric); their 1σ come from the linearised covariance of that fit, not from the sampler.',
    );
  for (const ring of solution.rings)
    if (ring.dof > 0 && ring.chi2 / ring.dof > 3)
      cautions.push(
        `Ring ${ring.ring}: χ²/dof is above 3: its dips scatter more than their sigmas allow${from === 'limb' ? ' (is the ring really centred on the limb centre?)' : ''}.`,
      );
  if (solution.rings.length > 0)
    cautions.push('Each ring gives two pole solutions; the occultation alone cannot tell them apart.');
  if (cautions.length === 0) cautions.push('Nothing was fixed; the ellipse model assumes a smooth limb.');
  return cautions;
}
