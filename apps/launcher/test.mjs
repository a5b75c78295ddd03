// `npm test`: the whole stack on a throwaway cluster (ports 4320–4323), every suite, one summary line.
// `npm test -- --only=api,e2e` runs a subset (names: libs, web, api, e2e); further words are file
// filters for those suites, e.g. `npm test -- --only=api auth session`.
import { randomBytes } from 'node:crypto';
import { chmodSync, existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { LaunchError, aptInstall, bold, ensureDependencies, requireFreePorts, step, warn } from './common.mjs';
import { bringUp, build, stopCurrent } from './stack.mjs';
import { SUITES, runSuite } from './suites.mjs';

// CRIBRA_TEST_PORT_BASE moves the four test ports when another test stack already runs on this machine.
const BASE = Number(process.env.CRIBRA_TEST_PORT_BASE ?? 4320);
if (!Number.isInteger(BASE) || BASE < 1024 || BASE > 65000) {
  console.error(`CRIBRA_TEST_PORT_BASE must be a port number between 1024 and 65000, got "${process.env.CRIBRA_TEST_PORT_BASE}".`);
  process.exit(2);
}
const PORTS = { api: BASE, pg: BASE + 1, smtp: BASE + 2, mailWeb: BASE + 3 };
const CHROMIUM = '/usr/bin/chromium';
// The API tests compile the LaTeX exports (pdflatex, pgfplots) and read the PDFs back (pdftotext).
const TEX_TOOLS = ['/usr/bin/pdflatex', '/usr/bin/pdftotext', '/usr/bin/pdftoppm'];
const TEX_PACKAGES = ['texlive-latex-base', 'texlive-latex-recommended', 'texlive-pictures', 'poppler-utils'];
const hasPgfplots = () => ['/usr/share/texlive/texmf-dist/tex/latex/pgfplots/pgfplots.sty', '/usr/share/texmf/tex/latex/pgfplots/pgfplots.sty'].some(existsSync);

function selectedSuites() {
  const arg = process.argv.slice(2).find((a) => a.startsWith('--only='));
  if (!arg) return SUITES;
  const names = arg.slice('--only='.length).split(',').map((s) => s.trim()).filter(Boolean);
  const unknown = names.filter((n) => !SUITES.some((s) => s.name === n));
  if (unknown.length) throw new LaunchError(`Unknown suite(s) ${unknown.join(', ')}; choose from ${SUITES.map((s) => s.name).join(', ')}.`);
  return SUITES.filter((s) => names.includes(s.name));
}

const t0 = Date.now();
let tmp;
let stack;
let cleaning = false;

async function cleanup() {
  if (cleaning) return;
  cleaning = true;
  await stopCurrent(); // also covers a stack that was still starting
  if (tmp) rmSync(tmp, { recursive: true, force: true });
}

function summary(results) {
  console.log('');
  console.log(bold('Summary'));
  for (const r of results) {
    const time = r.seconds === undefined ? '' : ` (${r.seconds.toFixed(0)} s)`;
    console.log(`  ${r.suite.padEnd(5)} ${r.passed} passed, ${r.failed} failed${r.skipped ? `, ${r.skipped} skipped` : ''}${time}`);
    for (const n of r.notes) console.log(`        ${n}`);
  }
  const passed = results.reduce((a, r) => a + r.passed, 0);
  const failed = results.reduce((a, r) => a + r.failed, 0);
  console.log(`  total time ${((Date.now() - t0) / 1000).toFixed(0)} s`);
  console.log(`${passed} passed, ${failed} failed`);
  return failed;
}

async function main() {
  const suites = selectedSuites();
  const filters = process.argv.slice(2).filter((a) => !a.startsWith('--'));
  const results = [];
  process.on('SIGINT', () => cleanup().then(() => process.exit(130)));
  process.on('SIGTERM', () => cleanup().then(() => process.exit(143)));

  tmp = mkdtempSync(join(tmpdir(), 'cribra-test-'));
  chmodSync(tmp, 0o755); // the postgres user must be able to enter it when we run as root
  const baseEnv = { ...process.env, CRIBRA_ENV: 'test' };
  let env = baseEnv;
  try {
    const needStack = suites.some((s) => s.stack);
    if (needStack) {
      await requireFreePorts([
        [PORTS.api, 'test API'],
        [PORTS.pg, 'test PostgreSQL'],
        [PORTS.smtp, 'test SMTP fake'],
        [PORTS.mailWeb, 'test SMTP fake inbox'],
      ]);
    }
    ensureDependencies();
    if (needStack) {
      build();
      stack = await bringUp({
        ports: PORTS,
        dataDir: join(tmp, 'postgres'),
        sessionSecret: randomBytes(32).toString('hex'),
        envName: 'test',
        // Browser tests sign in many times within a minute; the rate limit itself is tested by Jest.
        extraEnv: { SIGNIN_RATE_LIMIT: '100' },
      });
      env = { ...stack.env, BASE_URL: stack.env.PUBLIC_URL, CHROMIUM_PATH: CHROMIUM };
    }
  } catch (e) {
    console.error(`\n✖ Setting up the test stack failed: ${e instanceof LaunchError ? e.message : (e.stack ?? e)}`);
    await cleanup();
    summary([{ suite: 'setup', passed: 0, failed: 1, skipped: 0, notes: ['no suite could run'] }]);
    process.exit(1);
  }

  for (const suite of suites) {
    if (suite.browser && !existsSync(CHROMIUM)) {
      try {
        aptInstall(['chromium'], `Chromium for the browser tests (${CHROMIUM})`);
      } catch (e) {
        warn(e.message);
        results.push({ suite: suite.name, passed: 0, failed: 1, skipped: 0, notes: [`not run: ${CHROMIUM} is missing`] });
        continue;
      }
    }
    if (suite.latex && (!TEX_TOOLS.every(existsSync) || !hasPgfplots())) {
      try {
        aptInstall(TEX_PACKAGES, 'TeX Live and poppler-utils for the LaTeX export tests (pdflatex, pgfplots, pdftotext)');
      } catch (e) {
        warn(e.message);
        results.push({ suite: suite.name, passed: 0, failed: 1, skipped: 0, notes: ['not run: pdflatex, pgfplots or pdftotext is missing'] });
        continue;
      }
    }
    results.push(await runSuite(suite, { env, reportDir: tmp, filters }));
  }
  step('Tearing down the test stack…');
  await cleanup();
  const failed = summary(results);
  process.exit(failed ? 1 : 0);
}

main().catch(async (e) => {
  console.error(e);
  await cleanup();
  console.log('0 passed, 1 failed');
  process.exit(1);
});
