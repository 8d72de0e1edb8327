import type { TimingDetail, TimingResult } from '../api/timing-schema';

// An invented station's timing: 200 samples at 0.1 s, a square well from 8.0 s to 12.0 s and one dip.
const times = Array.from({ length: 200 }, (_, k) => k * 0.1);
const model = times.map((t) => (t >= 8 && t <= 12 ? 0 : t >= 15 && t <= 15.3 ? 0.4 : 1));

export const TEST_RESULT: TimingResult = {
  format: 'limbus-timing/1',
  disappearance: { time: '2028-03-14T02:13:48.000250Z', sigmaSeconds: 0.12 },
  reappearance: { time: '2028-03-14T02:13:52.000000Z', sigmaSeconds: 0.2 },
  baselineFlux: 1,
  bottomFlux: 0,
  chi2: 195.2,
  dof: 192,
  fresnelScaleKm: 1.4,
  starDiameterKm: 0,
  noiseSigmaFlux: 0.02,
  eventSignificance: 80,
  dips: [
    {
      start: { time: '2028-03-14T02:13:55.000000Z', sigmaSeconds: 0.03 },
      end: { time: '2028-03-14T02:13:55.300000Z', sigmaSeconds: 0.03 },
      apparentOpacity: 0.6,
      apparentOpticalDepth: 0.916,
      equivalentWidthKm: 3.6,
      significance: 40,
      marked: false,
    },
  ],
  series: {
    originUtc: '2028-03-14T02:13:40.000000Z',
    timesSeconds: times,
    flux: model.map((m, k) => m + (k % 2 === 0 ? 0.01 : -0.01)),
    fluxErr: null,
    modelFlux: model,
  },
};

export const TEST_TIMING: TimingDetail = {
  id: 'tm1',
  reportId: 'r1',
  stationId: 's1',
  state: 'solved',
  error: null,
  options: {
    speedKmPerS: 20,
    distanceKm: 6e9,
    exposureSeconds: 0.1,
    wavelengthUm: 0.65,
    bandwidthUm: 0.3,
    starDiameterKm: 0,
    bottom: 'free',
    detectionSigma: 6,
    markedDips: [],
  },
  acceptedAt: null,
  ringEventsCreatedAt: null,
  createdAt: '2028-03-15T10:00:00.000Z',
  finishedAt: '2028-03-15T10:00:02.000Z',
  result: TEST_RESULT,
};
