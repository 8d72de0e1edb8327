// A first draft of the figure caption: what was fitted, what was held fixed, and the numbers an author
// would quote. Authors rewrite it; its job is to make sure nothing the fit assumed goes unmentioned.
import {
  LIMB_PARAMETERS,
  type FitOptions,
  type LimbParameter,
  type RingCenterFrom,
  type Solution,
} from '@limbus/geometry';
import { formatValueSigma } from './number-format';

const LIMB_NAMES: Record<LimbParameter, string> = {
  centerFKm: 'centre f',
  centerGKm: 'centre g',
  equatorialRadiusKm: 'equatorial radius',
  oblateness: 'oblateness',
  positionAngleDeg: 'position angle',
};

const LIMB_UNITS: Record<LimbParameter, string> = {
  centerFKm: 'km',
  centerGKm: 'km',
  equatorialRadiusKm: 'km',
  oblateness: '',
  positionAngleDeg: '°',
};

function withUnit(text: string, unit: string): string {
  if (unit === '') return text;
  return unit === '°' ? `${text}°` : `${text} ${unit}`;
}

/** How a ring's centre was found, as the caption says it; "joint" without a limb was reported as "free". */
const RING_CENTRE_WORDS: Record<RingCenterFrom, string> = {
  limb: 'centre held at the limb centre',
  free: 'centre fitted freely',
  joint: 'centre fitted jointly with the limb',
};

export function captionDraft(title: string, solution: Solution, fit: FitOptions): string {
  const positives = solution.chords.filter((c) => c.type === 'positive').length;
  const negatives = solution.chords.length - positives;
  const parts: string[] = [
    `Sky-plane solution of ${title}: ${positives} positive and ${negatives} negative chord${negatives === 1 ? '' : 's'}, ` +
      'f towards east and g towards north (km), north up and east left as seen on the sky.',
  ];
  const limb = solution.limb;
  if (limb !== null) {
    const fixed = LIMB_PARAMETERS.filter((p) => fit.limb.fixed[p] !== undefined);
    const fitted = LIMB_PARAMETERS.filter((p) => fit.limb.fixed[p] === undefined);
    const fixedText =
      fixed.length === 0
        ? 'nothing held fixed'
        : 'held fixed: ' +
          fixed
            .map((p) => `${LIMB_NAMES[p]} = ${withUnit(String(fit.limb.fixed[p]), LIMB_UNITS[p])}`)
            .join(', ');
    parts.push(
      `Limb ellipse fitted for ${fitted.map((p) => LIMB_NAMES[p]).join(', ') || 'no parameter'} (${fixedText}); ` +
        `equivalent radius ${formatValueSigma(limb.equivalentRadiusKm, limb.uncertainty.equivalentRadiusKm)} km, ` +
        `oblateness ${formatValueSigma(limb.oblateness, limb.uncertainty.oblateness)}, ` +
        `position angle ${formatValueSigma(limb.positionAngleDeg, limb.uncertainty.positionAngleDeg)}°, ` +
        `chi2 ${limb.chi2.toFixed(2)} for ${limb.dof} degrees of freedom` +
        (fit.limb.modelErrorKm > 0 ? `, with ${fit.limb.modelErrorKm} km added for limb topography` : '') +
        '. The shaded band spans the 1-sigma ellipses.',
    );
    if (limb.timeOffsets.length > 0)
      parts.push(
        'Clock offsets fitted for ' +
          limb.timeOffsets.map((t) => `${t.station} (${formatValueSigma(t.seconds, t.sigma)} s)`).join(', ') +
          '.',
      );
  } else {
    parts.push('No limb was fitted (no positive chord).');
  }
  for (const ring of solution.rings)
    parts.push(
      `Ring ${ring.ring}: radius ${formatValueSigma(ring.radiusKm, ring.uncertainty.radiusKm)} km, ` +
        `opening angle ${formatValueSigma(ring.openingAngleDeg, ring.uncertainty.openingAngleDeg)}°, ` +
        `position angle ${formatValueSigma(ring.positionAngleDeg, ring.uncertainty.positionAngleDeg)}°, ` +
        RING_CENTRE_WORDS[ring.centerFrom ?? fit.ring.centerFrom] +
        '.',
    );
  parts.push(
    'Error bars are 1-sigma timing errors projected along each chord; dashed lines are negative chords.',
  );
  return parts.join(' ');
}
