import { describe, expect, it } from 'vitest';
import { sigmaEllipse, unwrapRaDeg } from './format';

describe('unwrapRaDeg', () => {
  it('unwrapRaDeg() moves RA across 0h to the side of the reference', () => {
    expect(unwrapRaDeg(359, 1)).toBe(-1);
    expect(unwrapRaDeg(1, 359)).toBe(361);
    expect(unwrapRaDeg(41, 221)).toBe(41);
    expect(unwrapRaDeg(200, 10)).toBe(-160);
  });
});

describe('sigmaEllipse', () => {
  it('sigmaEllipse() gives σx, σy along the axes without correlation, and a line at 45° with full correlation', () => {
    // Uncorrelated: the ellipse's semi-axes are the two sigmas (the definition of the 1σ ellipse).
    const plain = sigmaEllipse(9, 4, 0);
    expect(plain).toEqual({ rx: 3, ry: 2, angleDeg: 0 });
    // σx = σy = 1, ρ = 1: all the spread lies along x = y, √2 long (eigenvalues 2 and 0, by hand).
    const line = sigmaEllipse(1, 1, 1);
    expect(line.rx).toBeCloseTo(Math.SQRT2, 12);
    expect(line.ry).toBe(0);
    expect(line.angleDeg).toBeCloseTo(45, 12);
    // The ellipse's quadratic form reproduces the covariance: rx²cos²θ + ry²sin²θ = xx (by hand).
    const e = sigmaEllipse(5, 2, -1.5);
    const t = (e.angleDeg * Math.PI) / 180;
    expect(e.rx ** 2 * Math.cos(t) ** 2 + e.ry ** 2 * Math.sin(t) ** 2).toBeCloseTo(5, 12);
    expect((e.rx ** 2 - e.ry ** 2) * Math.sin(t) * Math.cos(t)).toBeCloseTo(-1.5, 12);
  });
});
