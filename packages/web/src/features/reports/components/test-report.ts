import type { Report } from '../api/get-reports';

/** A submitted positive report of an invented observer, with every field of the report view. */
export function testReport(overrides: Partial<Report> = {}): Report {
  return {
    id: 'r1',
    eventId: 'e1',
    stationId: 's1',
    station: 'kestrel-hill',
    authorId: 'u2',
    authorName: 'Wren Ashby',
    result: 'positive',
    timesFromLightCurve: false,
    disappearance: { time: '2029-05-17T03:12:31.25Z', sigmaSeconds: 0.04 },
    reappearance: { time: '2029-05-17T03:12:49.9Z', sigmaSeconds: 0.05 },
    observedFromUtc: null,
    observedToUtc: null,
    ringDips: [],
    notes: null,
    lightCurve: null,
    state: 'submitted',
    rejectReason: null,
    chord: null,
    latestTiming: null,
    corrections: [],
    createdAt: '2029-05-17T09:00:00.000Z',
    updatedAt: '2029-05-17T09:00:00.000Z',
    ...overrides,
  };
}
