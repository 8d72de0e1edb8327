import { describe, expect, it } from 'vitest';
import { unwrapRaDeg } from './format';

describe('unwrapRaDeg', () => {
  it('unwrapRaDeg() moves RA across 0h to the side of the reference', () => {
    expect(unwrapRaDeg(359, 1)).toBe(-1);
    expect(unwrapRaDeg(1, 359)).toBe(361);
    expect(unwrapRaDeg(41, 221)).toBe(41);
    expect(unwrapRaDeg(200, 10)).toBe(-160);
  });
});
