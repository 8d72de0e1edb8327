// First-order propagation of 1-sigma for quantities that are products of powers of independent inputs.
// Every result of the dynamics context (Roche limits, resonance radii, Kepler's third law, the Hill radius)
// is such a monomial, y = C·∏ xᵢ^eᵢ, so its logarithmic partial derivatives are exactly the exponents eᵢ and
// σ_y/y = √Σ (eᵢ σᵢ/xᵢ)² to first order (Taylor, An Introduction to Error Analysis, 2nd ed., 1997, §3.11,
// "general formula for error propagation"). Tracking exponents per input name keeps correlations right when
// the same input enters twice (e.g. the body radius in both the density and the Roche limit).

export interface Quantity {
  readonly value: number;
  /** ∂ ln(value) / ∂ ln(input), keyed by the input's JSON path. */
  readonly exponents: Readonly<Record<string, number>>;
}

export function constant(value: number): Quantity {
  return { value, exponents: {} };
}

export function input(path: string, value: number): Quantity {
  return { value, exponents: { [path]: 1 } };
}

export function times(...factors: Quantity[]): Quantity {
  const exponents: Record<string, number> = {};
  let value = 1;
  for (const factor of factors) {
    value *= factor.value;
    for (const [path, exponent] of Object.entries(factor.exponents)) {
      exponents[path] = (exponents[path] ?? 0) + exponent;
    }
  }
  return { value, exponents };
}

export function power(base: Quantity, exponent: number): Quantity {
  const exponents: Record<string, number> = {};
  for (const [path, e] of Object.entries(base.exponents)) exponents[path] = e * exponent;
  return { value: base.value ** exponent, exponents };
}

export function over(numerator: Quantity, denominator: Quantity): Quantity {
  return times(numerator, power(denominator, -1));
}

export function scaled(quantity: Quantity, factor: number): Quantity {
  return { value: quantity.value * factor, exponents: quantity.exponents };
}

/** 1-sigma of `quantity`, given each independent input's 1-sigma relative to its value (σᵢ/xᵢ). */
export function sigmaOf(quantity: Quantity, relativeSigmas: Readonly<Record<string, number>>): number {
  let sum = 0;
  for (const [path, exponent] of Object.entries(quantity.exponents)) {
    const relative = relativeSigmas[path] ?? 0;
    sum += (exponent * relative) ** 2;
  }
  return Math.abs(quantity.value) * Math.sqrt(sum);
}

/**
 * First-order covariance of two such quantities: cov = y₁y₂ Σ e₁ᵢ e₂ᵢ (σᵢ/xᵢ)², non-zero only through the
 * inputs they share (Taylor, An Introduction to Error Analysis, 2nd ed., §9.2, from memory).
 */
export function covarianceOf(
  a: Quantity,
  b: Quantity,
  relativeSigmas: Readonly<Record<string, number>>,
): number {
  let sum = 0;
  for (const [path, exponent] of Object.entries(a.exponents)) {
    const other = b.exponents[path];
    if (other === undefined) continue;
    sum += exponent * other * (relativeSigmas[path] ?? 0) ** 2;
  }
  return a.value * b.value * sum;
}
