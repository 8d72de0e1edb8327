import { makeStyles, tokens } from '@fluentui/react-components';
import type { ComparisonFit } from '../api/get-comparison';
import type { JointPoleDocument } from '../api/joint-pole';
import type { PoleSigma } from '../api/get-comparison';
import { fitColour, sigmaEllipse, unwrapRaDeg } from '../format';

const W_PX = 480;
const H_PX = 360;
const M = { top: 16, right: 16, bottom: 44, left: 56 };

const useStyles = makeStyles({
  svg: { width: '100%', maxWidth: `${W_PX}px`, height: 'auto', fontFamily: tokens.fontFamilyBase },
});

interface Candidate {
  key: string;
  raDeg: number;
  decDeg: number;
  colour: string;
  solution: 1 | 2;
  label: string;
  sigma: PoleSigma | null;
}

function ticks(lo: number, hi: number): number[] {
  const rough = (hi - lo) / 5;
  const p = 10 ** Math.floor(Math.log10(rough));
  const m = rough / p;
  const step = (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
  const out: number[] = [];
  for (let v = Math.ceil(lo / step) * step; v <= hi + 1e-9; v += step) out.push(Number(v.toFixed(6)));
  return out;
}

export interface PoleChartProps {
  fits: ComparisonFit[];
  ring: string | null;
  joint: JointPoleDocument | null;
}

/**
 * Pole candidates on the sky: both solutions of each event's ring fit with their 1σ regions, and the joint
 * pole with its own. A region is the ellipse of the (RA, Dec) covariance, correlation included, drawn in
 * these coordinates. RA grows to the left, as on the sky.
 */
export function PoleChart({ fits, ring, joint }: PoleChartProps) {
  const styles = useStyles();
  const candidates: Candidate[] = [];
  fits.forEach((fit, i) => {
    const r = fit.rings.find((g) => g.ring === ring);
    r?.poles.forEach((p, k) =>
      candidates.push({
        key: `${fit.fitId}-${k}`,
        raDeg: p.raDeg,
        decDeg: p.decDeg,
        colour: fitColour(i),
        solution: k === 0 ? 1 : 2,
        label: `${fit.eventTitle}, solution ${k + 1}`,
        sigma: p.uncertainty ?? null,
      }),
    );
  });
  const refRa = joint?.pole.raDeg ?? candidates[0]?.raDeg ?? 0;
  // Each candidate's 1σ extent is inside the frame, so every region is drawn whole.
  const ras = candidates.flatMap((c) => {
    const ra = unwrapRaDeg(c.raDeg, refRa);
    const s = c.sigma?.raDeg ?? 0;
    return [ra - s, ra + s];
  });
  const decs = candidates.flatMap((c) => [
    c.decDeg - (c.sigma?.decDeg ?? 0),
    c.decDeg + (c.sigma?.decDeg ?? 0),
  ]);
  if (joint !== null) {
    ras.push(joint.pole.raDeg - joint.uncertainty.raDeg, joint.pole.raDeg + joint.uncertainty.raDeg);
    ras.push(unwrapRaDeg(joint.alternativePole.raDeg, refRa));
    decs.push(joint.pole.decDeg - joint.uncertainty.decDeg, joint.pole.decDeg + joint.uncertainty.decDeg);
    decs.push(joint.alternativePole.decDeg);
  }
  const pad = (lo: number, hi: number): [number, number] => {
    const span = Math.max(hi - lo, 2);
    const mid = (hi + lo) / 2;
    return [mid - span * 0.6, mid + span * 0.6];
  };
  const [raLo, raHi] = pad(Math.min(...ras, refRa), Math.max(...ras, refRa));
  const [decLo, decHi] = pad(Math.min(...decs, 0), Math.max(...decs, 0));
  const pw = W_PX - M.left - M.right;
  const ph = H_PX - M.top - M.bottom;
  const x = (ra: number) => M.left + ((raHi - unwrapRaDeg(ra, refRa)) / (raHi - raLo)) * pw;
  const y = (dec: number) => M.top + ((decHi - dec) / (decHi - decLo)) * ph;
  const wrap360 = (v: number) => ((v % 360) + 360) % 360;
  // Degrees to pixels along each axis (RA to the left, Dec up); the covariance scales by their product.
  const sx = -pw / (raHi - raLo);
  const sy = -ph / (decHi - decLo);
  const region = (raDeg: number, decDeg: number, sigma: PoleSigma) => {
    const c = sigma.correlation * sigma.raDeg * sigma.decDeg;
    const e = sigmaEllipse((sx * sigma.raDeg) ** 2, (sy * sigma.decDeg) ** 2, sx * sy * c);
    const cx = x(raDeg);
    const cy = y(decDeg);
    return {
      cx,
      cy,
      rx: e.rx,
      ry: e.ry,
      transform: `rotate(${e.angleDeg.toFixed(2)} ${cx.toFixed(1)} ${cy.toFixed(1)})`,
    };
  };

  return (
    <svg
      className={styles.svg}
      viewBox={`0 0 ${W_PX} ${H_PX}`}
      role="img"
      aria-label={`Pole candidates of ring ${ring ?? '—'}: ${candidates.length} event solutions${joint === null ? '' : ' and the joint pole'}`}
    >
      <title>Ring pole candidates (RA, Dec)</title>
      <rect x={M.left} y={M.top} width={pw} height={ph} fill="none" stroke="#3b4a4f" strokeWidth={0.8} />
      {ticks(raLo, raHi).map((v) => (
        <g key={`ra${v}`}>
          <line x1={x(v)} x2={x(v)} y1={M.top + ph} y2={M.top + ph + 4} stroke="#3b4a4f" />
          <text x={x(v)} y={M.top + ph + 16} textAnchor="middle" fontSize={11}>
            {wrap360(v)}
          </text>
        </g>
      ))}
      {ticks(decLo, decHi).map((v) => (
        <g key={`dec${v}`}>
          <line x1={M.left - 4} x2={M.left} y1={y(v)} y2={y(v)} stroke="#3b4a4f" />
          <text x={M.left - 6} y={y(v) + 4} textAnchor="end" fontSize={11}>
            {v}
          </text>
        </g>
      ))}
      <text x={M.left + pw / 2} y={H_PX - 8} textAnchor="middle" fontSize={12}>
        Right ascension (°), increasing to the left
      </text>
      <text transform={`translate(14,${M.top + ph / 2}) rotate(-90)`} textAnchor="middle" fontSize={12}>
        Declination (°)
      </text>
      {joint !== null ? (
        <g data-role="joint-pole">
          <ellipse
            {...region(joint.pole.raDeg, joint.pole.decDeg, {
              ...joint.uncertainty,
              correlation: joint.uncertainty.correlation ?? 0,
            })}
            fill="#000"
            fillOpacity={0.12}
            stroke="#000"
            strokeWidth={0.8}
          >
            <title>Joint pole 1σ region</title>
          </ellipse>
          <path
            d={`M${x(joint.pole.raDeg)},${y(joint.pole.decDeg) - 7}L${x(joint.pole.raDeg) + 6},${y(joint.pole.decDeg) + 5}L${x(joint.pole.raDeg) - 6},${y(joint.pole.decDeg) + 5}Z`}
            fill="#000"
          >
            <title>
              Joint pole RA {joint.pole.raDeg.toFixed(2)}°, Dec {joint.pole.decDeg.toFixed(2)}°
            </title>
          </path>
          <path
            data-role="alternative-pole"
            d={`M${x(joint.alternativePole.raDeg)},${y(joint.alternativePole.decDeg) - 7}L${x(joint.alternativePole.raDeg) + 6},${y(joint.alternativePole.decDeg) + 5}L${x(joint.alternativePole.raDeg) - 6},${y(joint.alternativePole.decDeg) + 5}Z`}
            fill="none"
            stroke="#000"
            strokeDasharray={joint.ambiguityResolved ? '2 2' : undefined}
          >
            <title>
              Best pole of the other family, χ² {joint.alternativePole.chi2.toFixed(1)}
              {joint.ambiguityResolved ? ' (ruled out)' : ' (still possible)'}
            </title>
          </path>
        </g>
      ) : null}
      {candidates.map((c) =>
        c.sigma === null ? null : (
          <ellipse
            key={`${c.key}-sigma`}
            data-pole-sigma={c.key}
            {...region(c.raDeg, c.decDeg, c.sigma)}
            fill="none"
            stroke={c.colour}
            strokeWidth={0.8}
            strokeDasharray={c.solution === 1 ? undefined : '3 2'}
          >
            <title>
              {c.label}: RA ± {c.sigma.raDeg.toFixed(2)}°, Dec ± {c.sigma.decDeg.toFixed(2)}° (1σ),
              correlation {c.sigma.correlation.toFixed(2)}
            </title>
          </ellipse>
        ),
      )}
      {candidates.map((c) =>
        c.solution === 1 ? (
          <circle key={c.key} data-pole={c.key} cx={x(c.raDeg)} cy={y(c.decDeg)} r={4.5} fill={c.colour}>
            <title>{c.label}</title>
          </circle>
        ) : (
          <rect
            key={c.key}
            data-pole={c.key}
            x={x(c.raDeg) - 4}
            y={y(c.decDeg) - 4}
            width={8}
            height={8}
            fill="none"
            stroke={c.colour}
            strokeWidth={1.6}
          >
            <title>{c.label}</title>
          </rect>
        ),
      )}
    </svg>
  );
}
