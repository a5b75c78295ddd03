// The whole Cribra stack for one run: build, PostgreSQL, migrations, demo data, SMTP fake, API, runner.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, LaunchError, requireFreePorts, run, startService, step, stopService, waitForHttp, warn } from './common.mjs';
import { cluster, ensurePostgresBinaries } from './postgres.mjs';
import { supervise } from './supervisor.mjs';

const node = process.execPath;
const bin = (p) => join(ROOT, 'node_modules', p);

function newestMtime(path) {
  if (!existsSync(path)) return 0;
  const st = statSync(path);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = 0;
  for (const name of readdirSync(path)) {
    if (name === 'node_modules' || name === 'dist') continue;
    newest = Math.max(newest, newestMtime(join(path, name)));
  }
  return newest;
}

/** `tsc -b` (node packages) then `vite build` (web app; skipped when its output is newer than every input). */
export function build({ forceWeb = false } = {}) {
  step('Compiling TypeScript (tsc -b)…');
  run(node, [bin('typescript/bin/tsc'), '-b'], { what: 'tsc -b (type errors above)' });
  step('Compiling the WebAssembly sieve kernel (AssemblyScript)…');
  run(node, [join(ROOT, 'libs/engine/scripts/build-wasm.mjs')], { what: 'the WebAssembly sieve kernel' });
  const index = join(ROOT, 'apps/web/dist/index.html');
  const inputs = ['apps/web', 'libs', 'vite.config.ts', 'package-lock.json'].map((p) => newestMtime(join(ROOT, p)));
  if (!forceWeb && existsSync(index) && statSync(index).mtimeMs > Math.max(...inputs)) {
    step('Web app is up to date (apps/web/dist).');
    return;
  }
  step('Building the web app (vite build)…');
  run(node, [bin('vite/bin/vite.js'), 'build', '--logLevel', 'warn'], { what: 'vite build' });
}

let current = null;

/** Stops whatever the latest bringUp() has started so far (also while it is still starting). */
export function stopCurrent() {
  return current ? current() : Promise.resolve();
}

/**
 * Brings up PostgreSQL and the services. `ports` = {api, pg, smtp, mailWeb}.
 * Returns {env, services, stop()}; stop() is idempotent and stops only what this call started.
 */
export async function bringUp({ ports, dataDir, dbName = 'cribra', sessionSecret, envName, extraEnv = {}, withRunner = true }) {
  const pgBin = ensurePostgresBinaries();
  await requireFreePorts([
    [ports.api, 'Cribra API and web'],
    [ports.smtp, 'SMTP fake'],
    [ports.mailWeb, 'SMTP fake inbox page'],
  ]);
  const pg = cluster({ bin: pgBin, dataDir, port: ports.pg });
  const services = [];
  let stopped = false;
  const stop = async () => {
    if (stopped) return;
    stopped = true;
    for (const svc of [...services].reverse()) await svc.stop();
    pg.stop();
  };
  current = stop;

  try {
    pg.init();
    await pg.start();
    if (pg.createDatabase(dbName)) step(`Created database ${dbName}.`);

    // Migrations, demo data and the role set-up run as the owner (postgres); the API and runners
    // connect as the app's role, which owns nothing and is no superuser (database-enforced lock).
    const appRole = process.env.CRIBRA_APP_ROLE ?? 'cribra_app';
    const ownerUrl = pg.url(dbName);
    const appUrl = Object.assign(new URL(ownerUrl), { username: appRole }).toString();
    const env = {
      ...process.env,
      DATABASE_URL: appUrl,
      DATABASE_OWNER_URL: ownerUrl,
      PORT: String(ports.api),
      PUBLIC_URL: `http://127.0.0.1:${ports.api}`,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(ports.smtp),
      MAIL_API_URL: `http://127.0.0.1:${ports.mailWeb}`,
      SESSION_SECRET: sessionSecret,
      SIGNUP_MODE: process.env.SIGNUP_MODE ?? 'open',
      WEB_DIST: join(ROOT, 'apps/web/dist'),
      CRIBRA_ENV: envName,
      ...extraEnv,
    };

    const ownerEnv = { ...env, DATABASE_URL: ownerUrl };
    step('Running database migrations…');
    run(node, ['apps/api/dist/database/migrate.js', 'up'], { env: ownerEnv, what: 'Migrations' });
    step('Loading the demo data…');
    run(node, ['apps/api/dist/demo/seed-demo.js'], { env: ownerEnv, what: 'Loading the demo data' });
    step(`Granting the database role ${appRole} (API and runners)…`);
    run(node, ['apps/api/dist/database/app-role.js', appRole], { env: ownerEnv, what: 'Setting up the database role' });

    step(`Starting the SMTP fake (SMTP ${ports.smtp}, inbox ${ports.mailWeb})…`);
    const mail = keepUp('mail', node, [
      bin('maildev/dist/bin/maildev.js'), '--smtp', String(ports.smtp), '--ip', '127.0.0.1',
      '--web', String(ports.mailWeb), '--web-ip', '127.0.0.1', '--silent',
    ], env);
    services.push(mail);
    await waitForHttp(`${env.MAIL_API_URL}/api/healthz`, { child: mail.child, name: 'The SMTP fake', timeoutMs: 30_000 });

    step(`Starting the API on 127.0.0.1:${ports.api}…`);
    const api = keepUp('api', node, ['apps/api/dist/main.js'], env);
    services.push(api);
    await waitForHttp(`${env.PUBLIC_URL}/api/health`, { child: api.child, name: 'The API', timeoutMs: 60_000 });

    const runnerMain = join(ROOT, 'apps/runner/dist/main.js');
    if (withRunner && existsSync(runnerMain)) {
      step('Starting one runner…');
      services.push(keepUp('runner', node, [runnerMain], env));
    } else if (withRunner) {
      warn('No runner yet (apps/runner/dist/main.js is missing): queued work will wait.');
    }
    return { env, services, stop };
  } catch (e) {
    await stop();
    throw e;
  }
}

/**
 * Starts a service under supervision: when it exits on its own (a crash, `kill -9`) it is started
 * again with back-off and a log line; the other services and PostgreSQL stay up. Back-off in
 * milliseconds from CRIBRA_RESTART_INITIAL_MS (1000) doubling up to CRIBRA_RESTART_MAX_MS (30000).
 */
function keepUp(name, cmd, args, env) {
  return supervise({
    name,
    start: () => startService(name, cmd, args, env),
    stopChild: (child) => stopService(child),
    log: (m) => warn(m),
    initialMs: Number(process.env.CRIBRA_RESTART_INITIAL_MS) || 1000,
    maxMs: Number(process.env.CRIBRA_RESTART_MAX_MS) || 30_000,
    onRestart: () => step(`${name} started again.`),
  });
}

export { LaunchError };
