// Helpers shared by start.mjs and test.mjs. Node built-ins only: these run before `npm install`.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import net from 'node:net';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
export const IS_ROOT = typeof process.getuid === 'function' && process.getuid() === 0;

const useColour = process.stdout.isTTY && !process.env.NO_COLOR;
const paint = (code, s) => (useColour ? `\x1b[${code}m${s}\x1b[0m` : s);
export const bold = (s) => paint('1', s);
export const dim = (s) => paint('2', s);

export function step(msg) {
  console.log(paint('36', '▸ ') + msg);
}
export function warn(msg) {
  console.log(paint('33', '! ') + msg);
}

/** An error whose message is shown to the user as is (no stack). */
export class LaunchError extends Error {}

/** Runs a command to completion, output shown; throws LaunchError on a non-zero exit. */
export function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { cwd: ROOT, stdio: 'inherit', ...opts });
  if (r.error) throw new LaunchError(`Could not run ${cmd}: ${r.error.message}`);
  if (r.status !== 0) throw new LaunchError(`${opts.what ?? [cmd, ...args].join(' ')} failed (exit code ${r.status ?? r.signal}).`);
  return r;
}

/** Runs a command quietly; returns {status, stdout, stderr}. */
export function capture(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { cwd: ROOT, encoding: 'utf8', ...opts });
  return { status: r.error ? -1 : r.status, stdout: r.stdout ?? '', stderr: (r.stderr ?? '') + (r.error ? r.error.message : '') };
}

export function hasCommand(name) {
  return capture('sh', ['-c', `command -v ${name}`]).status === 0;
}

/** True when nothing listens on 127.0.0.1:port. */
export function portFree(port) {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once('error', () => resolve(false));
    srv.listen({ port, host: '127.0.0.1', exclusive: true }, () => srv.close(() => resolve(true)));
  });
}

export async function requireFreePorts(ports) {
  for (const [port, what] of ports) {
    if (!(await portFree(port))) {
      throw new LaunchError(
        `Port ${port} on 127.0.0.1 (${what}) is already in use. Stop the program using it ` +
          `(for example another Cribra still running: \`ss -ltnp | grep ${port}\` shows which) and try again` +
          ` — or give \`npm start\` other ports with CRIBRA_PORT_BASE=4330 (uses 4330–4333).`,
      );
    }
  }
}

export async function waitForHttp(url, { timeoutMs = 60_000, child, name } = {}) {
  const until = Date.now() + timeoutMs;
  let last = '';
  while (Date.now() < until) {
    if (child && child.exitCode !== null) throw new LaunchError(`${name} exited (code ${child.exitCode}) before it was ready.`);
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2000) });
      if (res.ok) return;
      last = `HTTP ${res.status}`;
    } catch (e) {
      last = e.cause?.code ?? e.message;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new LaunchError(`${name ?? url} did not become ready within ${timeoutMs / 1000} s (${last}).`);
}

/**
 * Starts a long-running child in its own process group (so Ctrl-C reaches only the launcher,
 * which then stops children in order); its output is prefixed with the service name.
 */
export function startService(name, cmd, args, env) {
  const child = spawn(cmd, args, { cwd: ROOT, env, detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
  const prefix = dim(`[${name}] `);
  for (const stream of [child.stdout, child.stderr]) {
    let buf = '';
    stream.setEncoding('utf8');
    stream.on('data', (d) => {
      buf += d;
      let i;
      while ((i = buf.indexOf('\n')) >= 0) {
        process.stdout.write(prefix + buf.slice(0, i) + '\n');
        buf = buf.slice(i + 1);
      }
    });
    stream.on('end', () => buf && process.stdout.write(prefix + buf + '\n'));
  }
  child.serviceName = name;
  return child;
}

/** SIGTERM to the child's process group, SIGKILL after `graceMs`. */
export function stopService(child, graceMs = 8000) {
  return new Promise((resolve) => {
    if (!child || child.exitCode !== null || child.signalCode !== null) return resolve();
    const kill = (sig) => {
      try {
        process.kill(-child.pid, sig);
      } catch {
        try {
          child.kill(sig);
        } catch {
          /* already gone */
        }
      }
    };
    const timer = setTimeout(() => kill('SIGKILL'), graceMs);
    child.once('exit', () => {
      clearTimeout(timer);
      resolve();
    });
    kill('SIGTERM');
  });
}

/** Installs npm dependencies when node_modules is missing (a fresh clone). */
export function ensureDependencies() {
  if (existsSync(join(ROOT, 'node_modules', '.package-lock.json'))) return;
  const lock = existsSync(join(ROOT, 'package-lock.json'));
  step(`Installing npm dependencies (${lock ? 'npm ci' : 'npm install'}; a few minutes on a fresh machine)…`);
  run('npm', [lock ? 'ci' : 'install', '--no-audit', '--no-fund'], { what: 'Installing npm dependencies' });
}

/** Installs Debian packages as root, or explains what to install. */
export function aptInstall(packages, why) {
  const manual = `sudo apt-get install -y ${packages.join(' ')}`;
  if (!hasCommand('apt-get')) {
    throw new LaunchError(`${why} is missing and apt-get is not available here. Install ${packages.join(' ')} with your system's package manager and try again.`);
  }
  if (!IS_ROOT) {
    throw new LaunchError(`${why} is missing. Install it first (needs root):\n    ${manual}\nthen run the command again.`);
  }
  step(`Installing ${packages.join(' ')} from Debian's packages (${why})…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  run('apt-get', ['update'], { env, what: 'apt-get update' });
  run('apt-get', ['install', '-y', '--no-install-recommends', ...packages], { env, what: `apt-get install ${packages.join(' ')}` });
}
