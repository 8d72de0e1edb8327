/**
 * A small light curve that passes the upload check: UTC mid-exposure times 0.04 s apart, a dip in the middle,
 * and `rows` data rows (the parser wants at least 8).
 */
export function lightCurveCsv(rows = 12, withErrors = false): string {
  const lines = [withErrors ? 'time,flux,fluxErr' : 'time,flux'];
  const start = Date.UTC(2028, 2, 14, 2, 11, 4);
  for (let k = 0; k < rows; k++) {
    const time = new Date(start + 40 * k).toISOString();
    const flux = k > rows / 3 && k < (2 * rows) / 3 ? '0.11' : '1.00';
    lines.push(withErrors ? `${time},${flux},0.02` : `${time},${flux}`);
  }
  return lines.join('\n') + '\n';
}
