interface Mark {
  time: string;
  sigmaSeconds: number;
}

/**
 * What the light-curve plot draws: a timing's result fits this as it is; a raw uploaded curve has no
 * model (`modelFlux` null) and marks whatever times are known for it.
 */
export interface LightCurveFigure {
  series: {
    /** ISO UTC time of the first sample; the times below are seconds after it. */
    originUtc: string;
    timesSeconds: number[];
    flux: number[];
    modelFlux: number[] | null;
  };
  disappearance: Mark | null;
  reappearance: Mark | null;
  dips: Array<{ start: Mark; end: Mark; marked: boolean }>;
}

/**
 * Seconds of an ISO UTC time after the series origin. The integer milliseconds of Date.parse are
 * subtracted first, and the sub-millisecond digits added back from the text, so microseconds survive.
 */
export function secondsAfter(originUtc: string, isoUtc: string): number {
  const fraction = (text: string): number => {
    const m = /\.(\d+)Z$/.exec(text);
    return m?.[1] === undefined ? 0 : Number(`0.${m[1]}`) - Math.floor(Number(`0.${m[1]}`) * 1000) / 1000;
  };
  return (Date.parse(isoUtc) - Date.parse(originUtc)) / 1000 + (fraction(isoUtc) - fraction(originUtc));
}

export interface Domain {
  fromSeconds: number;
  toSeconds: number;
}

export function fullDomain(result: LightCurveFigure): Domain {
  const t = result.series.timesSeconds;
  return { fromSeconds: t[0] ?? 0, toSeconds: t[t.length - 1] ?? 1 };
}

/** Zooms about the centre by `factor` (< 1 in, > 1 out), never beyond the full span. */
export function zoomDomain(domain: Domain, factor: number, full: Domain): Domain {
  const centre = (domain.fromSeconds + domain.toSeconds) / 2;
  const fullSpan = full.toSeconds - full.fromSeconds;
  const half = Math.min(fullSpan, (domain.toSeconds - domain.fromSeconds) * factor) / 2;
  return clampDomain({ fromSeconds: centre - half, toSeconds: centre + half }, full);
}

/** Moves the window by `fraction` of its width, kept inside the full span. */
export function panDomain(domain: Domain, fraction: number, full: Domain): Domain {
  const shift = (domain.toSeconds - domain.fromSeconds) * fraction;
  return clampDomain({ fromSeconds: domain.fromSeconds + shift, toSeconds: domain.toSeconds + shift }, full);
}

function clampDomain(domain: Domain, full: Domain): Domain {
  const span = domain.toSeconds - domain.fromSeconds;
  if (domain.fromSeconds < full.fromSeconds)
    return { fromSeconds: full.fromSeconds, toSeconds: full.fromSeconds + span };
  if (domain.toSeconds > full.toSeconds)
    return { fromSeconds: full.toSeconds - span, toSeconds: full.toSeconds };
  return domain;
}

/** A window of `halfWidthSeconds` either side of a time, kept inside the full span. */
export function windowAround(timeSeconds: number, halfWidthSeconds: number, full: Domain): Domain {
  const half = Math.min(halfWidthSeconds, (full.toSeconds - full.fromSeconds) / 2);
  return clampDomain({ fromSeconds: timeSeconds - half, toSeconds: timeSeconds + half }, full);
}
