import { describe, expect, it } from 'vitest';

import { validateContextInput } from '../src/index.js';

const base = {
  format: 'limbus-context-input/1',
  body: { massKg: 1.7e21, radiusKm: 600, spinPeriodHours: 7.5 },
  particleDensityKgM3: 900,
  heliocentricDistanceAu: 41.3,
  satellites: [{ name: 'Tesk', periodDays: 9.4 }],
};

describe('validateContextInput() resonances', () => {
  it('validateContextInput() keeps the p:q resonances the user names, and reads a file without them', () => {
    const named = validateContextInput({
      ...base,
      resonances: [
        { p: 6, q: 1 },
        { p: 5, q: 2 },
      ],
    });
    expect(named.ok && named.input.resonances).toEqual([
      { p: 6, q: 1 },
      { p: 5, q: 2 },
    ]);
    const without = validateContextInput(base);
    expect(without.ok && without.input.resonances).toBeUndefined();
  });

  it('validateContextInput() refuses 1:1, ratios not in lowest terms, fractions and unknown keys, by path', () => {
    const result = validateContextInput({
      ...base,
      resonances: [
        { p: 2, q: 2 },
        { p: 12, q: 2 },
        { p: 2.5, q: 1 },
        { p: 3, q: 1, order: 2 },
      ],
    });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems).toEqual([
      { path: 'resonances[0]', message: "p and q must differ (1:1 is the satellite's own orbit)" },
      { path: 'resonances[1]', message: 'write 12:2 in lowest terms, 6:1' },
      { path: 'resonances[2].p', message: 'must be a whole number' },
      { path: 'resonances[3].order', message: 'unknown field (check the spelling)' },
    ]);
  });
});
