import type { PlacementAnswer } from '@limbus/schema/planning';

/** An invented placement answer: two suggestions, the second without a ground point. */
export function testPlacement(overrides: Partial<PlacementAnswer> = {}): PlacementAnswer {
  return {
    bodyRadiusKm: 111,
    ringsToo: false,
    spanKm: { fromKm: -111, toKm: 111 },
    sigmaCrossTrackKm: 20.4,
    stations: [{ stationId: 's1', code: 'amberfield', status: 'observing', crossTrackKm: 42.5 }],
    gapsBefore: [
      { fromKm: -111, toKm: 42.5, widthKm: 153.5 },
      { fromKm: 42.5, toKm: 111, widthKm: 68.5 },
    ],
    largestGapKmBefore: 153.5,
    largestGapKmAfter: 76.8,
    worstDistanceKmBefore: 76.8,
    worstDistanceKmAfter: 38.4,
    suggestions: [
      {
        crossTrackKm: -34.3,
        gap: { fromKm: -111, toKm: 42.5, widthKm: 153.5 },
        crosses: 'body',
        code: 'planned-1',
        site: {
          latDeg: 9.7412,
          lonDeg: 62.3055,
          timeUtc: '2029-09-07T21:33:10.000Z',
          starAltitudeDeg: 51.2,
          starAzimuthDeg: 128.4,
          sunAltitudeDeg: -41.7,
          distanceFromReferenceKm: 61.2,
        },
        noSiteReason: null,
      },
      {
        crossTrackKm: 76.8,
        gap: { fromKm: 42.5, toKm: 111, widthKm: 68.5 },
        crosses: 'body',
        code: 'planned-2',
        site: null,
        noSiteReason: 'Over the sea along the whole offset line.',
      },
    ],
    criteria: {
      sunAltitudeBelowDeg: -12,
      starAltitudeAboveDeg: 20,
      region: null,
      reference: { kind: 'stations', latDeg: 10.2, lonDeg: 62 },
    },
    cautions: ['A suggested point is a place on the map, not a site checked for access or safety.'],
    ...overrides,
  };
}
