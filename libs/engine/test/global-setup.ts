import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

// Worker-thread code runs from the built dist (a worker cannot load TypeScript), so build first;
// the WebAssembly sieve kernel too (dist/wasm, compiled from libs/engine/assembly).
export default function setup(): void {
  const root = fileURLToPath(new URL('../../..', import.meta.url));
  execFileSync(process.execPath, [require_tsc(root), '-b'], { cwd: root, stdio: 'inherit' });
  execFileSync(process.execPath, [`${root}/libs/engine/scripts/build-wasm.mjs`], { cwd: root, stdio: 'inherit' });
}

function require_tsc(root: string): string {
  return `${root}/node_modules/typescript/bin/tsc`;
}
