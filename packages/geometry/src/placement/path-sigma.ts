// The path's 1σ across its own direction at an instant: the offset's 1σ on the sky plane (D·σ_raCosDec
// along e_f, D·σ_dec along e_g, independent) projected on the path's left normal n (docs/method.md,
// "Prediction": the same projection the prediction gives each station as sigmaCrossTrackKm).
import { MAS_PER_RAD } from '../math.js';
import type { PredictionSky } from '../predict/sky-frame.js';
import type { PredictionSettings } from '../predict/types.js';

export function pathSigmaCrossTrackKm(
  sky: PredictionSky,
  settings: Pick<PredictionSettings, 'uncertaintyMas'>,
  ttSeconds: number,
): number {
  const body = sky.body(ttSeconds);
  const n = sky.leftNormal(body, ttSeconds);
  return Math.hypot(
    (body.distanceKm * settings.uncertaintyMas.raCosDec * n.fKm) / MAS_PER_RAD,
    (body.distanceKm * settings.uncertaintyMas.dec * n.gKm) / MAS_PER_RAD,
  );
}
