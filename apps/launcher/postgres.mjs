// A private PostgreSQL cluster on 127.0.0.1 (Debian's server binaries, our own data folder and port).
import { chownSync, existsSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { IS_ROOT, LaunchError, aptInstall, capture, requireFreePorts, run, step, warn } from './common.mjs';

function findPgBin() {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const versions = readdirSync(base)
    .filter((v) => existsSync(join(base, v, 'bin', 'initdb')) && existsSync(join(base, v, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? join(base, versions[0], 'bin') : null;
}

/** The bin folder of the newest installed PostgreSQL; installs Debian's `postgresql` when absent. */
export function ensurePostgresBinaries() {
  let bin = findPgBin();
  if (!bin) {
    aptInstall(['postgresql'], 'The PostgreSQL server (/usr/lib/postgresql/*/bin)');
    bin = findPgBin();
    if (!bin) throw new LaunchError('PostgreSQL was installed but no /usr/lib/postgresql/*/bin/initdb was found.');
  }
  return bin;
}

function postgresUserExists() {
  return capture('id', ['-u', 'postgres']).status === 0;
}

/**
 * Handle on one cluster. As root, initdb and the server run as the `postgres` user (initdb refuses
 * root) and the data folder belongs to it; otherwise they run as the current user.
 */
export function cluster({ bin, dataDir, port }) {
  const asPg = (cmd, args, opts) =>
    IS_ROOT ? run('runuser', ['-u', 'postgres', '--', join(bin, cmd), ...args], opts) : run(join(bin, cmd), args, opts);
  const asPgQuiet = (cmd, args) =>
    IS_ROOT ? capture('runuser', ['-u', 'postgres', '--', join(bin, cmd), ...args]) : capture(join(bin, cmd), args);
  const logFile = join(dataDir, 'server.log');
  const psql = (db, sql) => capture(join(bin, 'psql'), ['-X', '-q', '-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', '-d', db, '-tAc', sql]);
  let startedByUs = false;

  return {
    port,
    url: (db) => `postgres://postgres@127.0.0.1:${port}/${db}`,

    running() {
      return existsSync(join(dataDir, 'PG_VERSION')) && asPgQuiet('pg_ctl', ['-D', dataDir, 'status']).status === 0;
    },

    init() {
      if (existsSync(join(dataDir, 'PG_VERSION'))) {
        const have = readFileSync(join(dataDir, 'PG_VERSION'), 'utf8').trim();
        const bins = bin.split('/').at(-2);
        if (have !== bins) {
          throw new LaunchError(`The cluster in ${dataDir} was made by PostgreSQL ${have}, but the installed server is ${bins}. Move that folder away (it holds your data) or install postgresql-${have}.`);
        }
        return false;
      }
      if (IS_ROOT && !postgresUserExists()) {
        throw new LaunchError('Running as root, but there is no `postgres` system user to run the database server. Install Debian\'s postgresql package (it creates the user) or run as a normal user.');
      }
      mkdirSync(dataDir, { recursive: true, mode: 0o700 });
      if (IS_ROOT) {
        const uid = Number(capture('id', ['-u', 'postgres']).stdout.trim());
        const gid = Number(capture('id', ['-g', 'postgres']).stdout.trim());
        chownSync(dataDir, uid, gid);
        if (capture('runuser', ['-u', 'postgres', '--', 'test', '-w', dataDir]).status !== 0) {
          throw new LaunchError(`The postgres user cannot reach ${dataDir}: a parent folder is closed to other users. Clone Cribra to a folder others may enter (e.g. under /srv or /tmp) or run as a normal user.`);
        }
      }
      step(`Creating a PostgreSQL cluster in ${dataDir}…`);
      asPg('initdb', ['-D', dataDir, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8'], {
        what: 'initdb',
        stdio: ['ignore', 'ignore', 'inherit'],
      });
      return true;
    },

    async start() {
      if (this.running()) {
        warn(`PostgreSQL from an earlier run is still running on ${dataDir}; using it.`);
        startedByUs = true; // stop it at the end like our own
        return;
      }
      await requireFreePorts([[port, 'PostgreSQL']]);
      step(`Starting PostgreSQL on 127.0.0.1:${port}…`);
      // TCP on loopback only; no Unix socket, so no socket folder to own or to collide on.
      const opts = `-p ${port} -c listen_addresses=127.0.0.1 -c unix_socket_directories= -c max_connections=200`;
      try {
        asPg('pg_ctl', ['-D', dataDir, '-l', logFile, '-w', '-t', '60', '-o', opts, 'start'], {
          what: 'Starting PostgreSQL',
          stdio: ['ignore', 'ignore', 'inherit'],
        });
      } catch (e) {
        const tail = existsSync(logFile) ? readFileSync(logFile, 'utf8').split('\n').slice(-12).join('\n') : '';
        throw new LaunchError(`${e.message}\nLast lines of ${logFile}:\n${tail}`);
      }
      startedByUs = true;
    },

    stop() {
      if (!startedByUs) return;
      startedByUs = false;
      const r = asPgQuiet('pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
      if (r.status !== 0 && this.running()) warn(`pg_ctl stop failed: ${r.stderr.trim()}`);
    },

    createDatabase(name) {
      const exists = psql('postgres', `SELECT 1 FROM pg_database WHERE datname = '${name}'`);
      if (exists.status !== 0) throw new LaunchError(`Cannot reach PostgreSQL on port ${port}: ${exists.stderr.trim()}`);
      if (exists.stdout.trim() === '1') return false;
      const r = psql('postgres', `CREATE DATABASE "${name}"`);
      if (r.status !== 0) throw new LaunchError(`Could not create database ${name}: ${r.stderr.trim()}`);
      return true;
    },
  };
}
