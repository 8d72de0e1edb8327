import type { ContextResult, DynamicsView, ResonanceNearRing, RingFit } from '../api/dynamics-schema';

// An invented body: radius 560 km, density 1700 kg/m³, particles 900 kg/m³, one satellite "Oru".
// Hand-made figures for drawing only (the API end-to-end test checks the computation itself): Roche
// limits and resonance radii follow from the inputs, the synchronous radius is a round number.
const figures = {
  massKg: 1.25e21,
  densityKgM3: 1700,
  rocheFluidKm: 1688.9,
  rocheRigidKm: 872.4,
  rocheFluidBodyRadii: 3.016,
  rocheRigidBodyRadii: 1.558,
  synchronousKm: 1400.0,
  hillKm: 5.1e5,
  spinOrbit: [
    { k: 2, radiusKm: 2222.4 },
    { k: 3, radiusKm: 2912.2 },
  ],
  meanMotion: [
    { satellite: 'Oru', p: 3, q: 1, order: 2, side: 'inner' as const, radiusKm: 6970.9, named: false },
    { satellite: 'Oru', p: 2, q: 1, order: 1, side: 'inner' as const, radiusKm: 9134.2, named: false },
  ],
  ringRadii: [],
};

// The fitted ring 2030 ± 40 km against the 1:2 spin–orbit radius 2222.4 ± 88 km of the figures above:
// 2030 − 2222.4 = −192.4 km, 1σ √(40² + 88²) = 96.7 km, i.e. −4.81, −2.19 and −1.99 of the ring's, the
// resonance's and the combined 1σ.
export const TEST_NEAREST: ResonanceNearRing = {
  kind: 'spin-orbit',
  satellite: null,
  p: 1,
  q: 2,
  radiusKm: 2222.4,
  radiusKmSigma: 88,
  distanceKm: -192.4,
  distanceKmSigma: 96.7,
  distanceInRingSigma: -4.81,
  distanceInResonanceSigma: -2.19,
  distanceInSigma: -1.99,
};

export const TEST_CONTEXT: ContextResult = {
  format: 'limbus-context/1',
  ...figures,
  massFrom: 'densityKgM3',
  ringResonances: [],
  propagation: 'first-order',
  sources: { 'body.densityKgM3': 'invented' },
  notes: ['1-sigma by first-order propagation of the inputs taken as independent.'],
  uncertainty: {
    ...figures,
    massKg: 1.5e20,
    densityKgM3: 200,
    rocheFluidKm: 70,
    rocheRigidKm: 36,
    synchronousKm: 56,
    hillKm: 2e4,
    spinOrbit: [
      { k: 2, radiusKm: 88 },
      { k: 3, radiusKm: 116 },
    ],
    meanMotion: [
      { satellite: 'Oru', p: 3, q: 1, order: 2, side: 'inner' as const, radiusKm: 24, named: false },
      { satellite: 'Oru', p: 2, q: 1, order: 1, side: 'inner' as const, radiusKm: 31, named: false },
    ],
  },
};

export const TEST_RING_FIT: RingFit = {
  fitId: 'f1',
  eventId: 'e1',
  eventTitle: 'Invented occultation, night one',
  ring: 'R1',
  radiusKm: 2030,
  radiusKmSigma: 40,
  inBodyRadii: 3.625,
  inRocheFluid: 1.202,
  inRocheRigid: 2.327,
  inSynchronous: 1.45,
  uncertainty: { inBodyRadii: 0.1, inRocheFluid: 0.05, inRocheRigid: 0.1, inSynchronous: 0.06 },
  nearestResonances: [TEST_NEAREST],
};

export const TEST_VIEW: DynamicsView = {
  bodyId: 'b1',
  input: {
    format: 'limbus-context-input/1',
    body: {
      densityKgM3: 1700,
      densityKgM3Sigma: 200,
      radiusKm: 560,
      radiusKmSigma: 10,
      spinPeriodHours: 8.9,
    },
    particleDensityKgM3: 900,
    heliocentricDistanceAu: 43.1,
    satellites: [{ name: 'Oru', semiMajorAxisKm: 14500, semiMajorAxisKmSigma: 50 }],
    rings: [],
    spinOrbitK: [2, 3],
  },
  result: TEST_CONTEXT,
  ringFits: [TEST_RING_FIT],
  updatedAt: '2028-03-15T10:00:00.000Z',
};
