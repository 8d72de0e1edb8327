// A small valid event file in the invented scenario (body "Varkas", star and stations invented), used as
// the base that each test breaks in one way.

export function validEventJson(): Record<string, unknown> {
  return {
    format: 'limbus-event/1',
    title: 'Varkas, 2028-03-14',
    star: { raDeg: 101.25, decDeg: 18.5 },
    ephemeris: {
      timeScale: 'TDB',
      rows: [
        { time: '2028-03-14T02:00:00', raDeg: 101.2491, decDeg: 18.5003, distanceKm: 5.9e9 },
        { time: '2028-03-14T02:10:00', raDeg: 101.2497, decDeg: 18.5001, distanceKm: 5.9e9 },
        { time: '2028-03-14T02:20:00', raDeg: 101.2503, decDeg: 18.4999, distanceKm: 5.9e9 },
        { time: '2028-03-14T02:30:00', raDeg: 101.2509, decDeg: 18.4997, distanceKm: 5.9e9 },
      ],
    },
    stations: [
      { id: 'north-ridge', latDeg: 38.2, lonDeg: -4.1, heightM: 820 },
      { id: 'salt-flat', latDeg: 37.9, lonDeg: -4.3, heightM: 410 },
    ],
    chords: [
      {
        station: 'north-ridge',
        type: 'positive',
        disappearance: { time: '2028-03-14T02:14:03.210Z', sigmaSeconds: 0.05 },
        reappearance: { time: '2028-03-14T02:14:41.870Z', sigmaSeconds: 0.05 },
      },
      { station: 'salt-flat', type: 'negative', start: '2028-03-14T02:10:00Z', end: '2028-03-14T02:20:00Z' },
    ],
  };
}
