import { describe, expect, it } from 'vitest';

import type { TimingResult } from '@limbus/geometry';

import {
  parseUtc,
  reportTimingProblems,
  ringEventOpacity,
  timingDocument,
  timingDocumentSchema,
} from '../src/index.js';

function origin() {
  const o = parseUtc('2031-05-20T03:14:00Z');
  if (typeof o === 'string') throw new Error(o);
  return o;
}

const dip = {
  start: { timeSeconds: 5.25, sigmaSeconds: 0.01 },
  end: { timeSeconds: 6.0, sigmaSeconds: 0.02 },
  apparentOpacity: 0.5,
  apparentOpacitySigma: 0.01,
  apparentOpticalDepth: Math.log(2),
  apparentOpticalDepthSigma: 0.02,
  normalOpticalDepth: null,
  normalOpticalDepthSigma: null,
  widthKm: 4.5,
  widthKmSigma: 0.1,
  equivalentWidthKm: 2.25,
  equivalentWidthKmSigma: 0.06,
  equivalentDepthKm: 4.5 * Math.log(2),
  equivalentDepthKmSigma: 0.1,
  lowerLimits: null,
  significance: 40,
  marked: false,
};

const result: TimingResult = {
  disappearance: null,
  reappearance: { timeSeconds: 12.5, sigmaSeconds: 0.004 },
  edgeSpeedsKmPerS: { disappearanceKmPerS: 6, reappearanceKmPerS: 2.6 },
  baselineFlux: 1000,
  bottomFlux: 80,
  chi2: 150,
  dof: 154,
  fresnelScaleKm: 1.4,
  starDiameterKm: 0.6,
  noiseSigmaFlux: null,
  eventSignificance: 50,
  dips: [dip],
  modelFlux: new Float64Array(0),
};

describe('timingDocument()', () => {
  it('timingDocument() writes a one-edge timing with its edge speeds and the dips in UTC', () => {
    const doc = timingDocument(result, origin());
    expect(doc.disappearance).toBeNull();
    // 12.5 s after 03:14:00 with six decimals (formatUtc).
    expect(doc.reappearance).toEqual({ time: '2031-05-20T03:14:12.500000Z', sigmaSeconds: 0.004 });
    expect(doc.edgeSpeedsKmPerS).toEqual({ disappearance: 6, reappearance: 2.6 });
    expect(doc.dips[0]?.start.time).toBe('2031-05-20T03:14:05.250000Z');
    expect(timingDocumentSchema.safeParse(doc).success).toBe(true);
  });

  it('timingDocumentSchema reads a document stored before the dips gained their 1-sigma', () => {
    const old = {
      format: 'limbus-timing/1',
      disappearance: null,
      reappearance: null,
      baselineFlux: 1,
      bottomFlux: null,
      chi2: 1,
      dof: 1,
      fresnelScaleKm: 1,
      starDiameterKm: 0,
      noiseSigmaFlux: null,
      eventSignificance: 1,
      dips: [
        {
          start: { time: 'a', sigmaSeconds: 1 },
          end: { time: 'b', sigmaSeconds: 1 },
          apparentOpacity: 0.5,
          apparentOpticalDepth: 0.69,
          equivalentWidthKm: 1,
          significance: 7,
          marked: false,
        },
      ],
    };
    expect(timingDocumentSchema.safeParse(old).success).toBe(true);
  });
});

describe('ringEventOpacity()', () => {
  it('ringEventOpacity() carries a measured opacity, a lower bound flagged, and nothing without a sigma', () => {
    const doc = timingDocument(result, origin());
    const measured = doc.dips[0];
    if (measured === undefined) throw new Error('dip');
    expect(ringEventOpacity(measured)).toEqual({ value: 0.5, sigma: 0.01, lowerLimit: false });
    const limits = {
      reason: 'narrower than one exposure',
      apparentOpacity: 0.2,
      apparentOpticalDepth: 0.22,
      normalOpticalDepth: null,
      equivalentDepthKm: 0.3,
    };
    expect(ringEventOpacity({ ...measured, lowerLimits: limits })).toEqual({
      value: 0.2,
      sigma: 0.01,
      lowerLimit: true,
    });
    const { apparentOpacitySigma: _dropped, ...stored } = measured;
    expect(ringEventOpacity(stored)).toBeNull();
  });
});

describe('reportTimingProblems()', () => {
  it('reportTimingProblems() takes a positive report with one time and refuses one with none', () => {
    const mark = { time: '2031-05-20T03:14:12.5Z' };
    expect(reportTimingProblems({ result: 'positive', reappearance: mark })).toEqual([]);
    expect(reportTimingProblems({ result: 'positive', disappearance: mark })).toEqual([]);
    expect(reportTimingProblems({ result: 'positive' }).map((p) => p.path)).toEqual(['disappearance']);
    expect(reportTimingProblems({ result: 'positive', timesFromLightCurve: true })).toEqual([]);
  });
});
