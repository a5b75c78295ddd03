// Whole-process sieve benchmark (figures, not tests): what a user waits for when running one
// command once — node start-up, module load, worker start and the sieve — alternated pair by pair
// with Debian's `primesieve` (not a project dependency: `apt-get install primesieve`). Called by the
// bench runner (`npm run bench -- sieve-process`); prints nothing itself.
// CRIBRA_BENCH_PAIRS (default 5) sets the number of pairs; CRIBRA_BENCH_1E12=1 adds π + twins to
// 10^12 on 2 workers against primesieve on 2 threads (about a minute or two per run on this machine).
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** The built CLI (apps/cli/dist/main.js), whichever of src or dist this module runs from. */
const CLI = join(__dirname, '..', '..', 'dist', 'main.js');

/** CPU seconds of the waited-for children of this process so far (Linux: cutime + cstime in /proc/self/stat). */
function childCpu(): number {
  const stat = readFileSync('/proc/self/stat', 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  // After the command name: state is field 3 of stat(5); cutime and cstime are fields 16 and 17.
  return (Number(fields[13]) + Number(fields[14])) / 100;
}

interface Run {
  seconds: number;
  cpu: number;
  out: string;
}

/** Runs one command to completion; wall and CPU time of the whole process. */
function run(cmd: string, args: readonly string[]): Run {
  const c0 = childCpu();
  const t0 = performance.now();
  const r = spawnSync(cmd, args, { encoding: 'utf8', maxBuffer: 1 << 24 });
  const seconds = (performance.now() - t0) / 1000;
  if (r.error) throw r.error;
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} exited with ${r.status}: ${r.stderr.split('\n')[0]}`);
  return { seconds, cpu: childCpu() - c0, out: r.stdout };
}

const ours = (to: string, workers: number): [string, string[]] => [process.execPath, [CLI, 'count', '--pattern', '0,2', '--to', to, '--workers', String(workers), '--json']];
const reference = (to: string, threads: number): [string, string[]] => ['primesieve', [to, '-c1', '-c2', `--threads=${threads}`, '--no-status']];

function referenceInstalled(): boolean {
  const r = spawnSync('primesieve', ['--version'], { encoding: 'utf8' });
  return !r.error && r.status === 0;
}

function twinsOf(r: Run, isReference: boolean): string {
  if (isReference) return /Twin primes:\s*(\d+)/.exec(r.out)?.[1] ?? '?';
  return String((JSON.parse(r.out) as { count: string | number }).count);
}

const median = (xs: readonly number[]): number => {
  const s = [...xs].sort((x, y) => x - y);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};
const sec = (x: number) => (x < 1 ? `${(x * 1000).toFixed(0)} ms` : `${x.toFixed(2)} s`);
const list = (xs: readonly number[], f: (x: number) => string) => xs.map(f).join(' / ');

/**
 * Alternates `a` and `b` for `pairs` pairs (a first in even pairs, b first in odd ones, so that a
 * trend in the machine's load hits both alike) and reports both times, the ratio a/b per pair and
 * its median. Also checks that both printed the same twin count.
 */
function pairs(label: string, a: [string, string[], boolean], b: [string, string[], boolean], n: number): Array<{ name: string; figure: string }> {
  const ta: Run[] = [];
  const tb: Run[] = [];
  for (let i = 0; i < n; i++) {
    if (i % 2 === 0) {
      ta.push(run(a[0], a[1]));
      tb.push(run(b[0], b[1]));
    } else {
      tb.push(run(b[0], b[1]));
      ta.push(run(a[0], a[1]));
    }
    const x = twinsOf(ta[i]!, a[2]);
    const y = twinsOf(tb[i]!, b[2]);
    if (x !== y) throw new Error(`${label}: twin counts differ (${x} against ${y})`);
  }
  const ratios = ta.map((r, i) => r.seconds / tb[i]!.seconds);
  const cpuRatios = ta.map((r, i) => r.cpu / tb[i]!.cpu);
  return [
    { name: `${label}: first, wall (cpu) per run`, figure: list(ta.map((r) => r.seconds), sec) + ` (cpu ${list(ta.map((r) => r.cpu), sec)})` },
    { name: `${label}: second, wall (cpu) per run`, figure: list(tb.map((r) => r.seconds), sec) + ` (cpu ${list(tb.map((r) => r.cpu), sec)})` },
    { name: `${label}: ratio first/second per pair (twins ${twinsOf(ta[0]!, a[2])} both)`, figure: list(ratios, (r) => `×${r.toFixed(2)}`) },
    { name: `${label}: median ratio (medians ${sec(median(ta.map((r) => r.seconds)))} vs ${sec(median(tb.map((r) => r.seconds)))})`, figure: `×${median(ratios).toFixed(2)}` },
    // CPU time of the whole process (all threads): steadier than the wall clock on a shared machine,
    // but blind to parallelism, so only meaningful between runs with the same number of threads.
    { name: `${label}: CPU ratio per pair, median`, figure: `${list(cpuRatios, (r) => `×${r.toFixed(2)}`)}; median ×${median(cpuRatios).toFixed(2)}` },
  ];
}

/** Where the whole-process time goes, then the pairs against the reference and 2 workers against 1. */
export async function benchSieveProcess(): Promise<Array<{ name: string; figure: string }>> {
  const n = Math.max(1, Number(process.env.CRIBRA_BENCH_PAIRS ?? 5) | 0);
  const out: Array<{ name: string; figure: string }> = [];
  // Start-up pieces, median of 5 each: bare node, the CLI on a range sieved in the calling thread
  // (start-up + module load + kernel), and on a short range given to one worker thread.
  const fixed: Array<[string, [string, string[]]]> = [
    ['node -e 0 (bare start-up)', [process.execPath, ['-e', '0']]],
    ['cribra count --to 1000 (start-up, module load, kernel, in the calling thread)', ours('1000', 1)],
    ['cribra count --to 1e8 --workers 1 (as above + one worker start + 10^8 sieved)', ours('1e8', 1)],
  ];
  for (const [name, [cmd, args]] of fixed) {
    const t = Array.from({ length: 5 }, () => run(cmd, args));
    out.push({ name, figure: `${sec(median(t.map((r) => r.seconds)))} (cpu ${sec(median(t.map((r) => r.cpu)))})` });
  }
  const has = referenceInstalled();
  const js: [string, string[], boolean] = [...ours('1e10', 1), false];
  js[1] = [...js[1], '--kernel', 'js'];
  if (has) {
    out.push(...pairs('π + twins to 10^10, cribra 1 worker vs primesieve 1 thread', [...ours('1e10', 1), false], [...reference('1e10', 1), true], n));
  } else {
    out.push({ name: 'primesieve (reference C sieve)', figure: 'not installed: apt-get install primesieve' });
  }
  out.push(...pairs('π + twins to 10^10, cribra 1 worker vs 2 workers', [...ours('1e10', 1), false], [...ours('1e10', 2), false], n));
  out.push(...pairs('π + twins to 10^10, cribra 1 worker: JavaScript sieve vs WebAssembly kernel', js, [...ours('1e10', 1), false], Math.min(n, 3)));
  if (process.env.CRIBRA_BENCH_1E12 === '1') {
    if (has) out.push(...pairs('π + twins to 10^12, cribra 2 workers vs primesieve 2 threads', [...ours('1e12', 2), false], [...reference('1e12', 2), true], 1));
    else {
      const r = run(...ours('1e12', 2));
      out.push({ name: `π + twins to 10^12, cribra 2 workers (twins ${twinsOf(r, false)})`, figure: `${sec(r.seconds)} (cpu ${sec(r.cpu)})` });
    }
  }
  return out;
}
