// Prints "N passed, N failed" from Vitest's JSON report (the last line CI reads).
import { existsSync, readFileSync } from 'node:fs';

const file = process.argv[2] ?? '.data/test-report.json';
if (!existsSync(file)) {
  console.log('0 passed, 1 failed');
  process.exit(1);
}
const report = JSON.parse(readFileSync(file, 'utf8'));
const failedSuites = report.testResults.filter((suite) => suite.status === 'failed' && suite.assertionResults.length === 0).length;
const failed = report.numFailedTests + failedSuites;
console.log(`${report.numPassedTests} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
