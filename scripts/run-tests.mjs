// Runs every test suite of the repository and ends with one plain line: "N passed, N failed".
// Suites: Vitest (projects core, server and browser: core unit specs beside their files, cross-project
// reference, property, package, contract and real-browser checks under tests/, server specs), then the
// Angular component specs of projects/locus-elements and of the console, projects/console (Angular's
// unit-test builder, Vitest + jsdom; npm run test:elements, npm run test:console). Exit code 0 only when something ran and nothing failed.
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, rmSync } from 'node:fs';

/**
 * Runs one suite that writes a Vitest JSON report and counts it. A suite that did not finish, wrote no
 * readable report, or exited non-zero with no failure in its report counts as (at least) one failure.
 */
function runSuite(label, command, args, report, timeoutMinutes) {
  rmSync(report, { force: true });
  // a hard ceiling so that a hung suite can never hold CI for its whole allowance
  const run = spawnSync(command, args, { stdio: 'inherit', timeout: timeoutMinutes * 60 * 1000 });
  if (run.error) console.error(`the ${label} run did not finish: ${run.error.message}`);
  let passed = 0;
  let failed = 0;
  try {
    const json = JSON.parse(readFileSync(report, 'utf8'));
    passed = json.numPassedTests;
    failed = json.numFailedTests + (json.numRuntimeErrorTestSuites ?? 0);
    for (const file of json.testResults ?? []) if (file.status === 'failed' && (file.assertionResults ?? []).length === 0) failed++;
  } catch (error) {
    console.error(`could not read the ${label} report (${error.message}); counting the run as failed`);
    failed = 1;
  }
  if (run.status !== 0 && failed === 0) failed = 1;
  return { passed, failed };
}

mkdirSync('test-artifacts', { recursive: true });
const vitestReport = 'test-artifacts/vitest-report.json';
const suites = [
  runSuite('test', 'npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile=${vitestReport}`], vitestReport, 30),
  // component specs: their own runner (the Angular compiler builds them); angular.json points its JSON report here
  runSuite('component test', 'npx', ['ng', 'test', 'locus-elements', '--watch=false'], 'test-artifacts/elements-report.json', 15),
  runSuite('console test', 'npx', ['ng', 'test', 'console', '--watch=false'], 'test-artifacts/console-report.json', 15),
];
const passed = suites.reduce((sum, s) => sum + s.passed, 0);
const failed = suites.reduce((sum, s) => sum + s.failed, 0);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 && passed > 0 ? 0 : 1);
