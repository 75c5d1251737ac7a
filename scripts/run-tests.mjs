// Runs every test suite of the repository and ends with one plain line: "N passed, N failed".
// Suites: Vitest (core unit specs beside their files, cross-project reference, property and package
// checks under tests/), then the Angular component specs of projects/locus-elements (Angular's unit-test
// builder, Vitest + jsdom; npm run test:elements). Exit code 0 only when something ran and nothing failed.
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync } from 'node:fs';

mkdirSync('test-artifacts', { recursive: true });
const report = 'test-artifacts/vitest-report.json';
rmSync(report, { force: true });
// a hard ceiling so that a hung suite can never hold CI for its whole allowance
const run = spawnSync('npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile=${report}`], { stdio: 'inherit', timeout: 30 * 60 * 1000 });
if (run.error) console.error(`the test run did not finish: ${run.error.message}`);

let passed = 0;
let failed = 0;
try {
  const json = JSON.parse(readFileSync(report, 'utf8'));
  passed = json.numPassedTests;
  failed = json.numFailedTests + (json.numRuntimeErrorTestSuites ?? 0);
  for (const file of json.testResults ?? []) if (file.status === 'failed' && (file.assertionResults ?? []).length === 0) failed++;
} catch (error) {
  console.error(`could not read the test report (${error.message}); counting the run as failed`);
  failed = Math.max(failed, 1);
}
if (run.status !== 0 && failed === 0) failed = 1;

// component specs: their own runner (the Angular compiler builds them), its own JSON report
const elementsReport = 'test-artifacts/elements-report.json';
rmSync(elementsReport, { force: true });
const elements = spawnSync('npx', ['ng', 'test', 'locus-elements', '--watch=false'], { stdio: 'inherit', timeout: 15 * 60 * 1000 });
if (elements.error) console.error(`the component test run did not finish: ${elements.error.message}`);
let elementsFailed = 0;
try {
  const json = JSON.parse(readFileSync(elementsReport, 'utf8'));
  passed += json.numPassedTests;
  elementsFailed = json.numFailedTests + (json.numRuntimeErrorTestSuites ?? 0);
  for (const file of json.testResults ?? []) if (file.status === 'failed' && (file.assertionResults ?? []).length === 0) elementsFailed++;
} catch (error) {
  console.error(`could not read the component test report (${error.message}); counting the run as failed`);
  elementsFailed = 1;
}
if (elements.status !== 0 && elementsFailed === 0) elementsFailed = 1;
failed += elementsFailed;
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 && passed > 0 ? 0 : 1);
