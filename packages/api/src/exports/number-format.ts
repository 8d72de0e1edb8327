// Rounding for people: the error to two significant digits and the value to the same decimal place, the
// usual convention for quoting a measurement (common practice, no source). Machine formats keep full precision.

/** Decimal places that give the error two significant digits; 0 for errors of 10 and more. */
export function decimalsForSigma(sigma: number): number {
  if (!(sigma > 0) || !Number.isFinite(sigma)) return 2;
  return Math.max(0, 1 - Math.floor(Math.log10(sigma)));
}

export function formatValueSigma(value: number, sigma: number): string {
  const d = decimalsForSigma(sigma);
  if (!(sigma > 0)) return value.toFixed(d);
  return `${value.toFixed(d)} ± ${sigma.toFixed(d)}`;
}
