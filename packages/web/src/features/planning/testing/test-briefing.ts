import type { Briefing, BriefingStation } from '@limbus/schema/planning';

const station = (overrides: Partial<BriefingStation>): BriefingStation => ({
  stationId: 's1',
  code: 'amberfield',
  status: 'observing',
  observerId: 'u-observer',
  observerName: 'Ilse Darrow',
  latDeg: 10.2,
  lonDeg: 62,
  heightM: 410,
  outlook: 'inside',
  closestTimeUtc: '2029-09-07T21:33:01.250Z',
  distanceKm: 42.5,
  crossTrackKm: 42.5,
  sigmaCrossTrackKm: 20.4,
  speedKmPerS: 18.2,
  disappearance: { timeUtc: '2029-09-07T21:32:55.600Z', sigmaSeconds: 0.45 },
  reappearance: { timeUtc: '2029-09-07T21:33:06.900Z', sigmaSeconds: 0.45 },
  rings: [{ ring: 'R1', window: ['2029-09-07T21:32:44.000Z', '2029-09-07T21:33:18.500Z'] }],
  watch: { fromUtc: '2029-09-07T21:32:30.000Z', toUtc: '2029-09-07T21:33:32.000Z' },
  pointing: {
    starAltitudeDeg: 48.3,
    starAzimuthDeg: 131.9,
    sunAltitudeDeg: -38.2,
    moonSeparationDeg: 74.6,
    moonIlluminatedFraction: 0.42,
    moonAltitudeDeg: 12.1,
  },
  notes: [],
  ...overrides,
});

/** An invented briefing: the shapes the server answers, no number of it a prediction. */
export function testBriefing(overrides: Partial<Briefing> = {}): Briefing {
  return {
    eventId: 'event-1',
    eventTitle: 'Quillon occults a test star',
    bodyName: 'Quillon',
    eventTimeUtc: '2029-09-07T21:33:00Z',
    bodyRadiusKm: 111,
    closestApproachUtc: '2029-09-07T21:33:00.000Z',
    link: 'http://limbus.test/events/event-1?section=shadow-path',
    offsetSource: null,
    stations: [
      station({}),
      station({
        stationId: 's2',
        code: 'brackenhill',
        status: 'planned',
        observerId: null,
        observerName: null,
        outlook: 'ring-only',
        crossTrackKm: -190.2,
        distanceKm: 190.2,
        disappearance: null,
        reappearance: null,
        rings: [{ ring: 'R1', window: ['2029-09-07T21:32:50.000Z', '2029-09-07T21:33:12.000Z'] }],
      }),
    ],
    predictionCautions: [
      'A prediction has an uncertainty: the path may lie 1σ = 20.4 km to either side of the line shown.',
    ],
    safetyCautions: [
      'Driving to a remote site at night: tell someone where you go.',
      'Ask before using private land.',
      'Never point a telescope near the Sun in twilight.',
      'Local rules come first.',
    ],
    ...overrides,
  };
}
