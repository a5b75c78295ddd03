// The launcher's supervisor: a child that exits is started again with back-off and a log line;
// stop() ends it for good. Real child processes (node -e …), short back-off.
import { spawn } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { supervise } from '../supervisor.mjs';
import { stopService } from '../common.mjs';

const node = process.execPath;
const wait = (ms) => new Promise((r) => setTimeout(r, ms));
async function until(cond, ms = 10_000) {
  const end = Date.now() + ms;
  while (!cond()) {
    if (Date.now() > end) throw new Error('condition not reached in time');
    await wait(20);
  }
}
const spawnNode = (code) => () => spawn(node, ['-e', code], { stdio: 'ignore', detached: true });

describe('supervise', () => {
  it('restarts a child that dies (kill -9), with a log line, and keeps the new one up', async () => {
    const lines = [];
    const svc = supervise({
      name: 'runner',
      start: spawnNode('setInterval(() => {}, 1000)'),
      stopChild: (c) => stopService(c, 2000),
      log: (m) => lines.push(m),
      initialMs: 50,
    });
    const first = svc.child;
    await wait(100);
    process.kill(first.pid, 'SIGKILL');
    await until(() => svc.restarts === 1 && svc.child !== first && svc.child.pid);
    expect(lines.some((l) => /runner exited \(SIGKILL\); restarting it in 0\.1 s \(restart 1\)/.test(l))).toBe(true);
    expect(svc.child.exitCode).toBeNull();
    const second = svc.child;
    await svc.stop();
    expect(second.exitCode !== null || second.signalCode !== null).toBe(true);
    await wait(200);
    expect(svc.restarts).toBe(1); // stopped on purpose: not restarted
  });

  it('backs off: the delay doubles on repeated crashes up to the maximum', async () => {
    const lines = [];
    const svc = supervise({
      name: 'mail',
      start: spawnNode('process.exit(3)'),
      stopChild: (c) => stopService(c, 2000),
      log: (m) => lines.push(m),
      initialMs: 100,
      maxMs: 400,
    });
    await until(() => lines.length >= 5);
    await svc.stop();
    const delays = lines.slice(0, 5).map((l) => Number(/in ([\d.]+) s/.exec(l)[1]));
    expect(delays).toEqual([0.1, 0.2, 0.4, 0.4, 0.4]);
    expect(lines[0]).toMatch(/^mail exited \(exit code 3\)/);
  });
});
