import { expect } from 'vitest';

/** Asserts |actual − expected| ≤ tolerance, with a message that shows all three. */
export function expectClose(actual: number, expected: number, tolerance: number): void {
  const ok = Math.abs(actual - expected) <= tolerance;
  expect(ok, `expected ${actual} to be within ${tolerance} of ${expected}`).toBe(true);
}
