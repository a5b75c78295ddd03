// `npm start`: one command from a fresh clone to a running Cribra on http://127.0.0.1:4310.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, LaunchError, bold, ensureDependencies, requireFreePorts, step, warn } from './common.mjs';
import { bringUp, build, stopCurrent } from './stack.mjs';

// CRIBRA_PORT_BASE moves all four ports (e.g. 4330 → 4330–4333) when another copy already runs.
const BASE = Number(process.env.CRIBRA_PORT_BASE ?? 4310);
const PORTS = { api: BASE, pg: BASE + 1, smtp: BASE + 2, mailWeb: BASE + 3 };
const DATA = join(ROOT, '.data');
const t0 = Date.now();

function sessionSecret() {
  // Kept in .data so that sessions survive restarts.
  const file = join(DATA, 'session-secret');
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('hex'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

function banner(env) {
  let users = [];
  try {
    users = JSON.parse(readFileSync(join(ROOT, 'seeds-demo/users.json'), 'utf8')).users;
  } catch {
    /* no demo users */
  }
  const w = Math.max(...users.map((u) => u.email.length), 10);
  console.log('');
  console.log(bold(`Cribra is running (ready in ${((Date.now() - t0) / 1000).toFixed(0)} s)`));
  console.log(`  App and API     ${bold(env.PUBLIC_URL + '/')}   (API under /api, OpenAPI at /api/docs)`);
  console.log(`  Mail inbox      ${env.MAIL_API_URL}/   (password-reset mails land here)`);
  console.log(`  PostgreSQL      ${env.DATABASE_URL}   (data in .data/postgres)`);
  console.log(`  More runners    DATABASE_URL=${env.DATABASE_URL} npm run runner`);
  if (users.length) {
    console.log('  Demo accounts:');
    for (const u of users) console.log(`    ${u.email.padEnd(w)}  ${u.password.padEnd(20)} ${u.siteRole}  ${u.displayName}`);
  }
  console.log('Press Ctrl-C to stop (the data stays in .data/).');
}

async function main() {
  if (!Number.isInteger(BASE) || BASE < 1024 || BASE > 65000) throw new LaunchError(`CRIBRA_PORT_BASE must be a port number between 1024 and 65000, got "${process.env.CRIBRA_PORT_BASE}".`);
  // Fail fast, before installing and building, when another program holds our ports.
  await requireFreePorts([
    [PORTS.api, 'Cribra API and web'],
    [PORTS.smtp, 'SMTP fake'],
    [PORTS.mailWeb, 'SMTP fake inbox page'],
  ]);
  // Ctrl-C while still starting: stop what is already up.
  const early = () => {
    step('Interrupted: stopping what was started…');
    stopCurrent().then(() => process.exit(130));
  };
  process.on('SIGINT', early);
  process.on('SIGTERM', early);
  mkdirSync(DATA, { recursive: true });
  ensureDependencies();
  build();
  const stack = await bringUp({
    ports: PORTS,
    dataDir: join(DATA, 'postgres'),
    sessionSecret: sessionSecret(),
    envName: 'development',
  });
  let stopping = false;
  const shutdown = async (code) => {
    if (stopping) return;
    stopping = true;
    step('Stopping Cribra (runner, API, SMTP fake, PostgreSQL)…');
    await stack.stop();
    step('Stopped. Data kept in .data/.');
    process.exit(code);
  };
  process.off('SIGINT', early);
  process.off('SIGTERM', early);
  process.on('SIGINT', () => shutdown(0));
  process.on('SIGTERM', () => shutdown(0));
  process.on('SIGHUP', () => shutdown(0));
  // A service that exits on its own is restarted by its supervisor (stack.mjs); only Ctrl-C stops all.
  banner(stack.env);
}

main().catch((e) => {
  if (e instanceof LaunchError) console.error(`\n✖ ${e.message}`);
  else console.error(e);
  process.exit(1);
});
