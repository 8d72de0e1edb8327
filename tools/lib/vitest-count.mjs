// Sums test cases over vitest JSON reports: prints "<passed> <failed>". A test file that fails
// before any test runs (import or syntax error) has no test cases, so it counts as one failure.
import { readFileSync } from 'node:fs';

let passed = 0;
let failed = 0;
for (const file of process.argv.slice(2)) {
  let report;
  try {
    report = JSON.parse(readFileSync(file, 'utf8'));
  } catch {
    failed += 1;
    continue;
  }
  passed += report.numPassedTests ?? 0;
  failed += report.numFailedTests ?? 0;
  for (const suite of report.testResults ?? []) {
    if (suite.status === 'failed' && (suite.assertionResults ?? []).length === 0) failed += 1;
  }
}
console.log(`${passed} ${failed}`);
