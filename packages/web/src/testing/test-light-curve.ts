// An invented station's light curve: 200 samples at 0.1 s, a square well from 8.0 s to 12.0 s and one
// dip, with the times a timing of it would give.
const times = Array.from({ length: 200 }, (_, k) => k * 0.1);
const model = times.map((t) => (t >= 8 && t <= 12 ? 0 : t >= 15 && t <= 15.3 ? 0.4 : 1));

export const TEST_SERIES = {
  originUtc: '2028-03-14T02:13:40.000000Z',
  timesSeconds: times,
  flux: model.map((m, k) => m + (k % 2 === 0 ? 0.01 : -0.01)),
  fluxErr: null,
  modelFlux: model,
};

export const TEST_EDGES = {
  disappearance: { time: '2028-03-14T02:13:48.000250Z', sigmaSeconds: 0.12 },
  reappearance: { time: '2028-03-14T02:13:52.000000Z', sigmaSeconds: 0.2 },
};

export const TEST_DIP = {
  start: { time: '2028-03-14T02:13:55.000000Z', sigmaSeconds: 0.03 },
  end: { time: '2028-03-14T02:13:55.300000Z', sigmaSeconds: 0.03 },
  apparentOpacity: 0.6,
  apparentOpticalDepth: 0.916,
  equivalentWidthKm: 3.6,
  significance: 40,
  marked: false,
};

/** The same curve as a CSV upload (time,flux), as an observer would send it. */
export function testLightCurveCsv(): string {
  const origin = Date.parse(TEST_SERIES.originUtc);
  const rows = TEST_SERIES.timesSeconds.map(
    (t, k) => `${new Date(origin + Math.round(t * 1000)).toISOString()},${TEST_SERIES.flux[k]?.toFixed(4)}`,
  );
  return ['time,flux', ...rows].join('\n') + '\n';
}
