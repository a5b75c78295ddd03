#!/usr/bin/env node
// Compiles the sieve kernel (libs/engine/assembly/sieve-kernel.ts) to libs/engine/dist/wasm/sieve-kernel.wasm
// with AssemblyScript from node_modules. Run by `npm run build:node` (so by `prepare`), by the
// test launcher's build and by the libs test setup; skipped when the output is newer than the source.
// Nothing prebuilt is committed or downloaded: the binary always comes from the source here.
import { existsSync, mkdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const engine = join(dirname(fileURLToPath(import.meta.url)), '..');
const source = join(engine, 'assembly', 'sieve-kernel.ts');
const output = join(engine, 'dist', 'wasm', 'sieve-kernel.wasm');
const asc = join(engine, '..', '..', 'node_modules', 'assemblyscript', 'bin', 'asc.js');

const fresh = existsSync(output) && statSync(output).mtimeMs > Math.max(statSync(source).mtimeMs, statSync(fileURLToPath(import.meta.url)).mtimeMs);
if (!fresh) {
  if (!existsSync(asc)) {
    process.stderr.write(`build-wasm: AssemblyScript is not installed (${asc}); run npm ci\n`);
    process.exit(1);
  }
  mkdirSync(dirname(output), { recursive: true });
  // No runtime (the kernel allocates nothing), fixed memory of 144 pages (9 MiB, see the layout in
  // the source), optimised for speed; SIMD and bulk memory are WebAssembly features Node 20 has.
  execFileSync(
    process.execPath,
    [asc, source, '--outFile', output, '--runtime', 'stub', '-O3', '--noAssert', '--initialMemory', '144', '--maximumMemory', '144', '--enable', 'simd,bulk-memory'],
    { stdio: 'inherit' },
  );
}
