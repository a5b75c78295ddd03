// Prime ledger benchmark (figures, not tests): the runner's ledger-block job without the database —
// blocks of LEDGER_BLOCK_SIZE with gaps and the ledger constellations, one after another in one
// thread — beside the plain π + twins count of the same range and the same statistics in one pass.
// CRIBRA_BENCH_LEDGER_TO (default 1e10) sets the range [0, to).
import { LEDGER_BLOCK_SIZE, LEDGER_CONSTELLATIONS } from '@cribra/contracts';
import { primeBlockToJson, sievePrimeBlock, type SieveKernel } from '@cribra/engine';
import { sieveKernel } from '@cribra/engine/node';

function cpuAndWall<T>(fn: () => T): { value: T; cpu: number; wall: number } {
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const value = fn();
  const c = process.cpuUsage(c0);
  return { value, cpu: (c.user + c.system) / 1e6, wall: (performance.now() - t0) / 1000 };
}

const f = (t: { cpu: number; wall: number }) => `cpu ${t.cpu.toFixed(2)} s (wall ${t.wall.toFixed(2)} s)`;

/** Per-block set-up: the time of a block of 30 integers near `at` with the ledger options. */
function setupMs(at: number, kernel: SieveKernel | undefined, options: object): number {
  const n = 200;
  const t = cpuAndWall(() => {
    for (let i = 0; i < n; i++) sievePrimeBlock(at + i * LEDGER_BLOCK_SIZE, at + i * LEDGER_BLOCK_SIZE + 29, { ...options, kernel });
  });
  return (1000 * t.cpu) / n;
}

export async function benchLedger(): Promise<Array<{ name: string; figure: string }>> {
  const to = Number(process.env.CRIBRA_BENCH_LEDGER_TO ?? 1e10);
  const blocks = Math.floor(to / LEDGER_BLOCK_SIZE);
  const ledger = { gaps: true, patterns: Object.values(LEDGER_CONSTELLATIONS).map((p) => [...p]) };
  const kernel = sieveKernel();
  sievePrimeBlock(0, 10_000_000, { ...ledger, kernel }); // warm-up
  sievePrimeBlock(0, 10_000_000, ledger);
  const label = `[0, ${to.toExponential(0)})`;
  const plain = cpuAndWall(() => sievePrimeBlock(0, blocks * LEDGER_BLOCK_SIZE - 1, { patterns: [[0, 2]], kernel }));
  const onePass = cpuAndWall(() => sievePrimeBlock(0, blocks * LEDGER_BLOCK_SIZE - 1, { ...ledger, kernel }));
  const inBlocks = cpuAndWall(() => {
    let primes = 0;
    for (let i = 0; i < blocks; i++) {
      primes += primeBlockToJson(sievePrimeBlock(i * LEDGER_BLOCK_SIZE, (i + 1) * LEDGER_BLOCK_SIZE - 1, { ...ledger, kernel })).primeCount;
    }
    return primes;
  });
  if (inBlocks.value !== plain.value.primeCount) throw new Error('the ledger blocks disagree with the plain count');
  return [
    { name: `plain π + twins ${label}, one pass, WebAssembly kernel, calling thread (π = ${plain.value.primeCount})`, figure: f(plain) },
    { name: `ledger statistics ${label} (gaps, ${ledger.patterns.length} constellations), one pass`, figure: f(onePass) },
    {
      name: `ledger ${label} in ${blocks} blocks of ${LEDGER_BLOCK_SIZE} as one runner computes them (×${(inBlocks.cpu / plain.cpu).toFixed(2)} the plain count, ×${(inBlocks.cpu / onePass.cpu).toFixed(2)} the one pass, in CPU)`,
      figure: f(inBlocks),
    },
    { name: 'per-block set-up near 10^10 (a block of 30 integers, ledger options): WebAssembly kernel', figure: `${setupMs(9e9, kernel, ledger).toFixed(2)} ms` },
    { name: 'per-block set-up near 10^10: JavaScript sieve', figure: `${setupMs(9e9, undefined, ledger).toFixed(2)} ms` },
  ];
}
