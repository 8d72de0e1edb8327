// A hand-made shadow-path map description for the specs of the map's drawings and files: an invented
// path across the ±180° meridian near Fiji, with a gap in its right limit, and one station per outlook.
import type { PredictionMap } from '@limbus/schema';

const point = (time: string, latDeg: number, lonDeg: number) => ({
  timeUtc: `2030-05-01T10:${time}.000Z`,
  latDeg,
  lonDeg,
});

export function exampleMap(): PredictionMap {
  return {
    eventId: '3f6c1b7e-0000-4000-8000-000000000001',
    eventTitle: 'Example <occultation> & test',
    closestApproachUtc: '2030-05-01T10:00:20.000Z',
    subsolarPoint: { latDeg: 15, lonDeg: 30 },
    sigmaCrossTrackKm: 42.5,
    lines: [
      {
        line: 'central',
        ring: null,
        sigma: 0,
        edge: 'limit',
        offsetKm: 0,
        points: [
          point('00:00', -20, 178),
          point('00:10', -19, 179),
          point('00:20', -18, -179),
          point('00:30', -17, -178),
        ],
      },
      {
        line: 'left',
        ring: null,
        sigma: 0,
        edge: 'limit',
        offsetKm: 365,
        points: [point('00:00', -17, 178.5), point('00:10', -16, 179.5), point('00:20', -15, -178.5)],
      },
      {
        // A gap between 10:00:10 and 10:00:40 (the line left the ground): two stretches.
        line: 'right',
        ring: null,
        sigma: 0,
        edge: 'limit',
        offsetKm: -365,
        points: [
          point('00:00', -23, 177.5),
          point('00:10', -22, 178.5),
          point('00:40', -19, 178.8),
          point('00:50', -18, 179.6),
        ],
      },
      {
        line: 'left',
        ring: 'R1',
        sigma: 0,
        edge: 'limit',
        offsetKm: 1100,
        points: [point('00:00', -10, 178), point('00:10', -9, 179)],
      },
      {
        line: 'left',
        ring: null,
        sigma: 1,
        edge: 'outer',
        offsetKm: 407.5,
        points: [point('00:00', -16.6, 178.5), point('00:10', -15.6, 179.5)],
      },
    ],
    ticks: [{ ...point('00:00', -20, 178), label: '10:00 UTC' }],
    stations: [
      {
        stationId: 's-inside',
        code: 'inside-site',
        status: 'observing',
        latDeg: -18.5,
        lonDeg: 178.4,
        outlook: 'inside',
      },
      {
        stationId: 's-ring',
        code: 'ring-site',
        status: 'planned',
        latDeg: -12,
        lonDeg: 178.6,
        outlook: 'ring-only',
      },
      {
        stationId: 's-out',
        code: 'far-site',
        status: 'proposed',
        latDeg: -5,
        lonDeg: 179,
        outlook: 'outside',
      },
    ],
    cautions: ['A prediction, not an observation.'],
  };
}
