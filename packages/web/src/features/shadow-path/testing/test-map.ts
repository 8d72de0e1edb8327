import type { PathPoint, PredictionMap } from '@limbus/schema/planning';

/** A line along a parallel, 0.5° of longitude per 30 s grid step from 2029-09-07 21:30:00 UTC. */
function parallel(latDeg: number, count = 13): PathPoint[] {
  return Array.from({ length: count }, (_, k) => ({
    timeUtc: new Date(Date.UTC(2029, 8, 7, 21, 30, 30 * k)).toISOString(),
    latDeg,
    lonDeg: 60 + 0.5 * k,
  }));
}

const line = (
  kind: 'central' | 'left' | 'right',
  latDeg: number,
  offsetKm: number,
  extra: Partial<PredictionMap['lines'][number]> = {},
): PredictionMap['lines'][number] => ({
  line: kind,
  ring: null,
  sigma: 0,
  edge: 'limit',
  offsetKm,
  points: parallel(latDeg),
  ...extra,
});

/**
 * An invented map (body of radius 111 km, about 1° of latitude on the ground; one ring at 333 km; 1σ of
 * 20 km), with one station of each outlook and status. Shapes only: no number here is a prediction.
 */
export function testMap(overrides: Partial<PredictionMap> = {}): PredictionMap {
  return {
    eventId: 'event-1',
    eventTitle: 'Quillon occults a test star',
    closestApproachUtc: '2029-09-07T21:33:00.000Z',
    subsolarPoint: { latDeg: 6, lonDeg: -110 },
    sigmaCrossTrackKm: 20,
    lines: [
      line('central', 10, 0),
      line('left', 11, 111),
      line('right', 9, -111),
      line('left', 13, 333, { ring: 'R1' }),
      line('right', 7, -333, { ring: 'R1' }),
      line('left', 10.8, 91, { sigma: 1, edge: 'inner' }),
      line('left', 11.2, 131, { sigma: 1, edge: 'outer' }),
      line('right', 9.2, -91, { sigma: 1, edge: 'inner' }),
      line('right', 8.8, -131, { sigma: 1, edge: 'outer' }),
      line('left', 10.4, 51, { sigma: 3, edge: 'inner' }),
      line('left', 11.6, 171, { sigma: 3, edge: 'outer' }),
      line('right', 9.6, -51, { sigma: 3, edge: 'inner' }),
      line('right', 8.4, -171, { sigma: 3, edge: 'outer' }),
    ],
    ticks: [
      { timeUtc: '2029-09-07T21:31:00.000Z', latDeg: 10, lonDeg: 61, label: '21:31 UTC' },
      { timeUtc: '2029-09-07T21:33:00.000Z', latDeg: 10, lonDeg: 63, label: '21:33 UTC' },
    ],
    stations: [
      {
        stationId: 's1',
        code: 'amberfield',
        status: 'observing',
        latDeg: 10.2,
        lonDeg: 62,
        outlook: 'inside',
      },
      {
        stationId: 's2',
        code: 'brackenhill',
        status: 'planned',
        latDeg: 12,
        lonDeg: 63,
        outlook: 'ring-only',
      },
      { stationId: 's3', code: 'cindervale', status: 'proposed', latDeg: 14, lonDeg: 64, outlook: 'outside' },
      {
        stationId: 's4',
        code: 'dunmarsh',
        status: 'observing',
        latDeg: 10,
        lonDeg: 64,
        outlook: 'star-down',
      },
      { stationId: 's5', code: 'eastwick', status: 'observing', latDeg: 10, lonDeg: 65, outlook: 'sun-up' },
    ],
    cautions: ['A prediction has an uncertainty: the shaded bands show 1σ and 3σ of the path.'],
    ...overrides,
  };
}
