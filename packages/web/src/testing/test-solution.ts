import type { Solution } from '@limbus/geometry';

/**
 * A small invented solution in the shape of limbus-solution/1: two positive chords and one negative of an
 * invented body, values chosen by hand (not a fit), for checking how results are shown.
 */
export const TEST_SOLUTION: Solution = {
  format: 'limbus-solution/1',
  chords: [
    {
      station: 'kestrel-hill',
      type: 'positive',
      points: [
        { fKm: -110, gKm: 20, event: 'disappearance', sigmaKm: 1.2 },
        { fKm: 110, gKm: 20, event: 'reappearance', sigmaKm: 1.4 },
      ],
      path: [
        { fKm: -400, gKm: 20 },
        { fKm: 400, gKm: 20 },
      ],
      velocityKmPerS: { f: 22.4, g: 0 },
    },
    {
      station: 'brackenmoor',
      type: 'positive',
      points: [
        { fKm: -90, gKm: -60, event: 'disappearance', sigmaKm: 2 },
        { fKm: 95, gKm: -60, event: 'reappearance', sigmaKm: 2 },
      ],
      path: [
        { fKm: -400, gKm: -60 },
        { fKm: 400, gKm: -60 },
      ],
      velocityKmPerS: { f: 22.4, g: 0 },
    },
    {
      station: 'tarn-end',
      type: 'negative',
      points: [],
      path: [
        { fKm: -400, gKm: 160 },
        { fKm: 400, gKm: 160 },
      ],
      velocityKmPerS: { f: 22.4, g: 0 },
    },
  ],
  limb: {
    centerFKm: 1.25,
    centerGKm: -3.5,
    equatorialRadiusKm: 121.4,
    oblateness: 0.082,
    positionAngleDeg: 31.7,
    equivalentRadiusKm: 116.3,
    uncertainty: {
      centerFKm: 0.9,
      centerGKm: 2.1,
      equatorialRadiusKm: 1.8,
      oblateness: 0.011,
      positionAngleDeg: 4.2,
      equivalentRadiusKm: 1.5,
    },
    chi2: 3.1,
    dof: 2,
    radialResidualsKm: [
      { station: 'kestrel-hill', event: 'disappearance', residualKm: 0.4 },
      { station: 'kestrel-hill', event: 'reappearance', residualKm: -0.6 },
    ],
    negativeChordsClear: true,
    timeOffsets: [{ station: 'brackenmoor', seconds: 0.21, sigma: 0.05 }],
    band: [],
  },
  rings: [],
  astrometry: {
    referenceTimeUtc: '2029-05-17T03:12:40.000Z',
    raOffsetCosDecMas: 12.3,
    decOffsetMas: -4.5,
    uncertainty: { raOffsetCosDecMas: 0.6, decOffsetMas: 0.8 },
  },
  engine: { version: '0.1.0', inputSha256: 'a'.repeat(64), seed: 7 },
};
