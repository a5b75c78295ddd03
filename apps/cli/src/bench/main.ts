// `npm run bench [-- FILTER]`: runs the benchmark areas and prints one table of figures.
// Each area module exports one async function returning rows { name, figure } and prints nothing.
import { benchLedger } from './ledger.bench';
import { benchClosedForms, benchLevels } from './levels.bench';
import { benchNarrow, benchNarrowSearch } from './narrow.bench';
import { benchSieve } from './sieve.bench';
import { benchSieveProcess } from './sieve-process.bench';
import { benchWheel } from './wheel.bench';

export interface BenchRow {
  readonly name: string;
  readonly figure: string;
}

const AREAS: ReadonlyArray<{ area: string; run: () => Promise<readonly BenchRow[]>; onlyByName?: boolean }> = [
  { area: 'wheel', run: benchWheel },
  { area: 'wheel-levels', run: benchLevels },
  { area: 'closed-forms', run: benchClosedForms },
  { area: 'sieve', run: benchSieve },
  { area: 'sieve-process', run: benchSieveProcess },
  { area: 'ledger', run: benchLedger },
  { area: 'narrow', run: benchNarrow },
  // Long (minutes): run it alone with `npm run bench -- narrowsearch`.
  { area: 'narrowsearch', run: benchNarrowSearch, onlyByName: true },
];

async function bench(filter: string | undefined): Promise<number> {
  // An exact area name runs that area alone (`sieve` is also part of `sieve-process`); otherwise every
  // area containing the word, except the long ones that run only when named.
  const exact = AREAS.filter((a) => a.area === filter?.toLowerCase());
  const chosen = exact.length > 0 ? exact : AREAS.filter((a) => !a.onlyByName && (!filter || a.area.includes(filter.toLowerCase())));
  if (chosen.length === 0) {
    process.stderr.write(`bench: no area matches "${filter}" (areas: ${AREAS.map((a) => a.area).join(', ')})\n`);
    return 2;
  }
  const rows: Array<[string, string, string]> = [];
  let failed = 0;
  for (const { area, run } of chosen) {
    process.stderr.write(`bench: ${area} …\n`);
    try {
      for (const r of await run()) rows.push([area, r.name, r.figure]);
    } catch (e) {
      failed++;
      rows.push([area, `FAILED: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}`, '—']);
    }
  }
  const header: [string, string, string] = ['area', 'measurement', 'figure'];
  const widths = [0, 1, 2].map((i) => Math.max(header[i]!.length, ...rows.map((r) => r[i]!.length)));
  const line = (r: readonly string[]) => `| ${r.map((c, i) => (i === 2 ? c.padStart(widths[i]!) : c.padEnd(widths[i]!))).join(' | ')} |`;
  const out = [line(header), `|${widths.map((w, i) => (i === 2 ? `${'-'.repeat(w + 1)}:` : '-'.repeat(w + 2))).join('|')}|`, ...rows.map(line)];
  process.stdout.write(`${out.join('\n')}\n`);
  process.stdout.write(`(node ${process.version}, ${new Date().toISOString()})\n`);
  return failed ? 1 : 0;
}

bench(process.argv[2]).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`bench: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 1;
  },
);
