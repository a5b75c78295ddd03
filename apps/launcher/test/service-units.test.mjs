// The systemd units documented in docs/scaling.md: extracted from the page, syntax-checked, and
// verified by `systemd-analyze verify` where it is installed (warnings count as failures).
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT } from '../common.mjs';

/** Every ```ini block that follows a line naming `/etc/systemd/system/<unit>`. */
export function unitsIn(markdown) {
  const units = {};
  const re = /`\/etc\/systemd\/system\/([\w@.-]+)`[^\n]*\n(?:[^\n]*\n)*?\n```ini\n([\s\S]*?)```/g;
  for (const m of markdown.matchAll(re)) units[m[1]] = m[2];
  return units;
}

const SECTIONS = new Set(['Unit', 'Service', 'Install']);

/** A small syntax check: known sections, Key=Value lines, absolute ExecStart, restart policy. */
export function checkUnit(name, text) {
  const problems = [];
  let section = null;
  const keys = {};
  text.split('\n').forEach((line, i) => {
    const where = `${name}:${i + 1}`;
    if (!line.trim() || line.startsWith('#') || line.startsWith(';')) return;
    const head = /^\[(\w+)\]$/.exec(line);
    if (head) {
      section = head[1];
      if (!SECTIONS.has(section)) problems.push(`${where}: unknown section [${section}]`);
      return;
    }
    const kv = /^([A-Za-z]+)=(.*)$/.exec(line);
    if (!kv) return problems.push(`${where}: not a Key=Value line: ${line}`);
    if (!section) return problems.push(`${where}: ${kv[1]} outside a section`);
    (keys[`${section}.${kv[1]}`] ??= []).push(kv[2]);
  });
  for (const exec of keys['Service.ExecStart'] ?? []) if (!exec.startsWith('/')) problems.push(`${name}: ExecStart must be an absolute path: ${exec}`);
  if (!keys['Service.ExecStart']) problems.push(`${name}: no ExecStart`);
  if (!keys['Install.WantedBy']) problems.push(`${name}: no WantedBy`);
  const type = keys['Service.Type']?.[0];
  if (type !== 'oneshot' && keys['Service.Restart']?.[0] !== 'always') problems.push(`${name}: a long-running service needs Restart=always`);
  return problems;
}

const units = unitsIn(readFileSync(join(ROOT, 'docs/scaling.md'), 'utf8'));

describe('service units in docs/scaling.md', () => {
  it('documents the migration, API and runner units', () => {
    expect(Object.keys(units).sort()).toEqual(['cribra-api.service', 'cribra-migrate.service', 'cribra-runner@.service']);
  });

  it('pass the syntax check', () => {
    for (const [name, text] of Object.entries(units)) expect(checkUnit(name, text)).toEqual([]);
    // The check is not blind: a broken unit is caught.
    expect(checkUnit('bad.service', '[Service]\nExecStart=node main.js\nRestart=no\n[Nope]\nx\n').length).toBe(5);
  });

  const analyze = spawnSync('sh', ['-c', 'command -v systemd-analyze']).status === 0;
  it.skipIf(!analyze)('pass systemd-analyze verify without a warning', () => {
    const dir = mkdtempSync(join(tmpdir(), 'cribra-units-'));
    try {
      for (const [name, text] of Object.entries(units)) writeFileSync(join(dir, name), text);
      const verify = (names) => spawnSync('systemd-analyze', ['verify', '--man=no', ...names.map((n) => join(dir, n))], { encoding: 'utf8' });
      const r = verify(Object.keys(units));
      const complaints = `${r.stdout}\n${r.stderr}`.split('\n').filter((l) => l.includes(dir));
      expect(complaints).toEqual([]);
      expect(r.status).toBe(0);
      // …and it does complain about a wrong key (so silence above means something).
      writeFileSync(join(dir, 'bad.service'), units['cribra-api.service'].replace('Restart=always', 'Restart=sometimes'));
      const bad = verify(['bad.service']);
      expect(`${bad.stdout}${bad.stderr}`).toMatch(/restart specifier/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
