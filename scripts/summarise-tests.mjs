// Sums vitest JSON reports (console and Node side) into the one closing line "N passed, N failed".
// A report that is missing or unreadable counts as one failure: a runner that crashed must not pass.
import { readFileSync } from 'node:fs';

let passed = 0;
let failed = 0;
let skipped = 0;
for (const file of process.argv.slice(2)) {
  try {
    const report = JSON.parse(readFileSync(file, 'utf8'));
    passed += report.numPassedTests;
    failed += report.numFailedTests;
    skipped += report.numPendingTests + (report.numTodoTests ?? 0);
    if (report.numFailedTestSuites > 0 && report.numFailedTests === 0) failed += report.numFailedTestSuites;
  } catch {
    process.stderr.write(`[clinometer] no readable test report at ${file}: counted as a failure\n`);
    failed += 1;
  }
}
process.stdout.write(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}\n`);
process.exitCode = failed > 0 || passed === 0 ? 1 : 0;
