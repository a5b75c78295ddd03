// Runs one test suite with its console output shown and a JSON report written, then counts it.
import { spawn } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, bold, step, warn } from './common.mjs';

const SUITE_TIMEOUT_MS = 20 * 60 * 1000;

/** The suites `npm test` runs, in order; `stack` = needs PostgreSQL, the SMTP fake and the API. */
export const SUITES = [
  { name: 'libs', title: 'vitest libs (engine, language, contracts, cli)', stack: false },
  { name: 'web', title: 'vitest web (components, jsdom)', stack: false },
  { name: 'api', title: 'jest api (HTTP tests on the real PostgreSQL)', stack: true, latex: true },
  { name: 'e2e', title: 'vitest e2e (browser tests on the running stack)', stack: true, browser: true },
];

function commandFor(suite, report, filters) {
  const node = process.execPath;
  if (suite.name === 'api') {
    return [node, [join(ROOT, 'node_modules/jest/bin/jest.js'), '--config', 'apps/api/jest.config.js', '--runInBand', '--forceExit', '--json', `--outputFile=${report}`, ...filters]];
  }
  return [node, [join(ROOT, 'node_modules/vitest/vitest.mjs'), 'run', '--project', suite.name, '--reporter=default', '--reporter=json', `--outputFile.json=${report}`, ...filters]];
}

/** Jest and vitest write the same JSON summary layout; file-level crashes count as failures too. */
export function countReport(report, exitCode) {
  const notes = [];
  if (!existsSync(report)) {
    return { passed: 0, failed: 1, skipped: 0, notes: [`no report written (exit code ${exitCode}): the suite crashed or found no test file`] };
  }
  let data;
  try {
    data = JSON.parse(readFileSync(report, 'utf8'));
  } catch (e) {
    return { passed: 0, failed: 1, skipped: 0, notes: [`unreadable report: ${e.message}`] };
  }
  const passed = data.numPassedTests ?? 0;
  let failed = data.numFailedTests ?? 0;
  const skipped = (data.numPendingTests ?? 0) + (data.numTodoTests ?? 0);
  for (const file of data.testResults ?? []) {
    const assertions = file.assertionResults ?? [];
    if (file.status === 'failed' && !assertions.some((a) => a.status === 'failed')) {
      failed += 1;
      notes.push(`${file.name.replace(ROOT + '/', '')} failed to run: ${(file.message ?? '').split('\n')[0].slice(0, 200)}`);
    }
  }
  if ((data.numTotalTests ?? passed + failed) === 0 && (data.testResults ?? []).length === 0) {
    failed += 1;
    notes.push('no test file found');
  }
  if (exitCode !== 0 && failed === 0) {
    failed += 1;
    notes.push(`exited with code ${exitCode} although no test failed`);
  }
  return { passed, failed, skipped, notes };
}

/** `filters`: file-name filters handed to Jest/vitest (from `npm test -- --only=api auth`). */
export function runSuite(suite, { env, reportDir, filters = [] }) {
  const report = join(reportDir, `${suite.name}.json`);
  const [cmd, args] = commandFor(suite, report, filters);
  console.log('');
  step(bold(`Suite ${suite.name}: ${suite.title}`));
  const started = Date.now();
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { cwd: ROOT, env, stdio: 'inherit' });
    const timer = setTimeout(() => {
      warn(`Suite ${suite.name} ran longer than ${SUITE_TIMEOUT_MS / 60000} min; stopping it.`);
      child.kill('SIGKILL');
    }, SUITE_TIMEOUT_MS);
    child.on('error', (e) => warn(`Could not start suite ${suite.name}: ${e.message}`));
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      const result = countReport(report, code ?? (signal ? 1 : 0));
      resolve({ suite: suite.name, seconds: (Date.now() - started) / 1000, ...result });
    });
  });
}
