// Rounding for people: the error to two significant digits and the value to the same decimal place
// (common practice, no source). The server's LaTeX table rounds the same way.
export function decimalsForSigma(sigma: number): number {
  if (!(sigma > 0) || !Number.isFinite(sigma)) return 2;
  return Math.max(0, 1 - Math.floor(Math.log10(sigma)));
}

export function formatValueSigma(value: number, sigma: number): string {
  const d = decimalsForSigma(sigma);
  return sigma > 0 ? `${value.toFixed(d)} ± ${sigma.toFixed(d)}` : value.toFixed(d);
}
