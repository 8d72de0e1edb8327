import { describe, expect, it } from 'vitest';
import { formatValueSigma } from './value-sigma';

describe('formatValueSigma', () => {
  it('formatValueSigma() rounds the error to two significant digits and the value to match', () => {
    expect(formatValueSigma(1080.04, 2.3)).toBe('1080.0 ± 2.3');
    expect(formatValueSigma(0.12, 0.00096)).toBe('0.12000 ± 0.00096');
    expect(formatValueSigma(1080.4, 12.3)).toBe('1080 ± 12');
  });
});
