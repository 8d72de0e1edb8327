import type { FitOptions } from '@limbus/geometry';
import { describe, expect, it } from 'vitest';
import { overlayFitOptions } from './fit-options';

const defaults: FitOptions = {
  limb: { fixed: { oblateness: 0 }, modelErrorKm: 2, fitTimeOffsets: ['a', 'b'] },
  ring: { centerFrom: 'limb' },
  seed: 7,
};

describe('overlayFitOptions()', () => {
  it('overlayFitOptions() with {} gives the defaults unchanged', () => {
    expect(overlayFitOptions(defaults, {})).toEqual(defaults);
  });

  it('overlayFitOptions() replaces only the keys given, at any depth', () => {
    expect(
      overlayFitOptions(defaults, { limb: { modelErrorKm: 5, fixed: { positionAngleDeg: 30 } } }),
    ).toEqual({
      limb: { fixed: { oblateness: 0, positionAngleDeg: 30 }, modelErrorKm: 5, fitTimeOffsets: ['a', 'b'] },
      ring: { centerFrom: 'limb' },
      seed: 7,
    });
  });

  it('overlayFitOptions() replaces lists whole and keeps bad values for the validator to name', () => {
    const out = overlayFitOptions(defaults, { limb: { fitTimeOffsets: ['c'] }, ring: 'free' }) as Record<
      string,
      unknown
    >;
    expect((out.limb as { fitTimeOffsets: string[] }).fitTimeOffsets).toEqual(['c']);
    expect(out.ring).toBe('free');
  });

  it('overlayFitOptions() does not change the defaults it was given', () => {
    overlayFitOptions(defaults, { limb: { fixed: { oblateness: 0.1 } } });
    expect(defaults.limb.fixed).toEqual({ oblateness: 0 });
  });
});
