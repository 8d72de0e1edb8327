import { describe, expect, it } from 'vitest';
import { formatValueSigma, unwrapRaDeg } from './format';

describe('formatValueSigma', () => {
  it('formatValueSigma() rounds the error to two significant digits and the value to match', () => {
    expect(formatValueSigma(1080.04, 2.3)).toBe('1080.0 ± 2.3');
    expect(formatValueSigma(0.12, 0.00096)).toBe('0.12000 ± 0.00096');
    expect(formatValueSigma(1080.4, 12.3)).toBe('1080 ± 12');
  });
});

describe('unwrapRaDeg', () => {
  it('unwrapRaDeg() moves RA across 0h to the side of the reference', () => {
    expect(unwrapRaDeg(359, 1)).toBe(-1);
    expect(unwrapRaDeg(1, 359)).toBe(361);
    expect(unwrapRaDeg(41, 221)).toBe(41);
    expect(unwrapRaDeg(200, 10)).toBe(-160);
  });
});
