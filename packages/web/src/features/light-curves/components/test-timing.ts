import type { TimingDetail, TimingResult } from '../api/timing-schema';
import { TEST_DIP, TEST_EDGES, TEST_SERIES } from '@/testing/test-light-curve';

export const TEST_RESULT: TimingResult = {
  format: 'limbus-timing/1',
  ...TEST_EDGES,
  baselineFlux: 1,
  bottomFlux: 0,
  chi2: 195.2,
  dof: 192,
  fresnelScaleKm: 1.4,
  starDiameterKm: 0,
  noiseSigmaFlux: 0.02,
  eventSignificance: 80,
  dips: [TEST_DIP],
  series: TEST_SERIES,
};

/** A timing of a curve that ends inside the event, with each edge's speed and a dip too short to resolve. */
export const TEST_ONE_EDGE_RESULT: TimingResult = {
  ...TEST_RESULT,
  reappearance: null,
  edgeSpeedsKmPerS: { disappearance: 8.72, reappearance: 20 },
  dips: [
    {
      ...TEST_DIP,
      apparentOpacitySigma: 0.021,
      apparentOpticalDepthSigma: 0.052,
      normalOpticalDepth: 0.499,
      normalOpticalDepthSigma: 0.03,
      widthKm: 0.6,
      widthKmSigma: 0.04,
      equivalentWidthKmSigma: 0.11,
      equivalentDepthKm: 0.55,
      equivalentDepthKmSigma: 0.05,
      lowerLimits: {
        reason: 'narrower than the Fresnel scale',
        apparentOpacity: 0.257,
        apparentOpticalDepth: 0.297,
        normalOpticalDepth: 0.162,
        equivalentDepthKm: 0.416,
      },
    },
  ],
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
  inChord: false,
  ringEventsCreatedAt: null,
  createdAt: '2028-03-15T10:00:00.000Z',
  finishedAt: '2028-03-15T10:00:02.000Z',
  result: TEST_RESULT,
};
