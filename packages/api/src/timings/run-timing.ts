// Step in the data flow: uploaded CSV bytes + stored options -> geometry fitTiming -> stored view.
// Pure, so the worker and the unit tests run the same code.
import { buildEdgeProfile, fitTiming, GeometryInputError } from '@limbus/geometry';
import { parseLightCurveCsv, parseUtc, secondsBetweenUtc } from '@limbus/schema';
import type { TimingOptions } from './timing-options';
import { timingView, type TimingView } from './timing-result';

/** Bad input a person can fix, in `path: message` lines; the job fails with these words. */
export class TimingInputError extends Error {}

export function runTiming(csvText: string, options: TimingOptions): TimingView {
  const parsed = parseLightCurveCsv(csvText);
  if (!parsed.ok)
    throw new TimingInputError(parsed.problems.map((i) => `${i.path}: ${i.message}`).join('; '));
  const series = parsed.curve;
  const last = series.timesSeconds[series.timesSeconds.length - 1] ?? 0;
  const markedDips = options.markedDips.map((d, k) => {
    const start = parseUtc(d.startUtc);
    const end = parseUtc(d.endUtc);
    if (typeof start === 'string') throw new TimingInputError(`markedDips[${k}].startUtc: ${start}`);
    if (typeof end === 'string') throw new TimingInputError(`markedDips[${k}].endUtc: ${end}`);
    const startSeconds = secondsBetweenUtc(start, series.origin);
    const endSeconds = secondsBetweenUtc(end, series.origin);
    if (!(endSeconds > startSeconds)) throw new TimingInputError(`markedDips[${k}]: ends before it starts`);
    if (endSeconds < 0 || startSeconds > last) {
      throw new TimingInputError(`markedDips[${k}]: lies outside the light curve`);
    }
    return { startSeconds, endSeconds };
  });
  const profile = buildEdgeProfile({
    distanceKm: options.distanceKm,
    wavelengthUm: options.wavelengthUm,
    bandwidthUm: options.bandwidthUm,
    starDiameterKm: options.starDiameterKm,
  });
  try {
    const result = fitTiming({
      timesSeconds: series.timesSeconds,
      flux: series.flux,
      ...(series.fluxErr === undefined ? {} : { fluxErr: series.fluxErr }),
      speedKmPerS: options.speedKmPerS,
      edgeSpeedsKmPerS: {
        disappearanceKmPerS: options.speedDisappearanceKmPerS ?? options.speedKmPerS,
        reappearanceKmPerS: options.speedReappearanceKmPerS ?? options.speedKmPerS,
      },
      ...(options.ringOpeningAngleDeg === undefined
        ? {}
        : {
            ringOpeningAngle: {
              valueDeg: options.ringOpeningAngleDeg,
              sigmaDeg: options.ringOpeningAngleSigmaDeg ?? 0,
            },
          }),
      exposureSeconds: options.exposureSeconds,
      profile,
      bottom: options.bottom,
      detectionSigma: options.detectionSigma,
      markedDips,
    });
    return timingView(series, result);
  } catch (error) {
    if (error instanceof GeometryInputError) throw new TimingInputError(`${error.path}: ${error.detail}`);
    throw error;
  }
}
