import type { BodyDetail, BodyEventRow } from '../api/get-body';

// The demo body, Quillon, with two invented events: one with an approved fit run on data that has
// changed since, and one whose only fit is still in review.
const measured = (value: number, sigma: number) => ({ value, sigma });

export const NIGHT_ONE: BodyEventRow = {
  id: 'e1',
  title: 'Quillon occults a 13th-magnitude star, night one',
  eventTimeUtc: '2031-07-02T20:14:07Z',
  counts: { stations: 13, chords: 9 },
  latestFit: {
    id: 'f2',
    state: 'solved',
    reviewState: 'approved',
    createdAt: '2031-07-04T09:30:00.000Z',
    inputMatchesEvent: false,
  },
  approvedFit: {
    id: 'f2',
    state: 'solved',
    reviewState: 'approved',
    createdAt: '2031-07-04T09:30:00.000Z',
    inputMatchesEvent: false,
    limb: {
      equatorialRadiusKm: measured(402.31, 1.84),
      oblateness: measured(0.1012, 0.0123),
      positionAngleDeg: measured(35.24, 0.31),
      chi2: 8.42,
      dof: 11,
    },
    rings: [{ ring: 'R1', radiusKm: measured(1080.04, 2.3) }],
  },
};

export const NIGHT_TWO: BodyEventRow = {
  id: 'e2',
  title: 'Quillon occults a 15th-magnitude star',
  eventTimeUtc: '2032-01-11T03:02:59Z',
  counts: { stations: 4, chords: 3 },
  latestFit: {
    id: 'f5',
    state: 'solved',
    reviewState: 'in_review',
    createdAt: '2032-01-12T08:00:00.000Z',
    inputMatchesEvent: true,
  },
  approvedFit: null,
};

export const QUILLON: BodyDetail = {
  id: 'b1',
  teamId: 't1',
  name: 'Quillon',
  designation: '2031 QL7',
  hasContext: false,
  updatedAt: '2032-01-12T08:00:00.000Z',
  context: null,
  events: [NIGHT_ONE, NIGHT_TWO],
};
