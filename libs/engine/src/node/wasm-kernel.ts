// Loads the WebAssembly sieve kernel built from libs/engine/assembly (scripts/build-wasm.mjs) and
// keeps one instance per thread: its memory holds that thread's segment and crossing state.
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { EngineError } from '../errors';
import { sievePrimeBlock, SieveKernel, type PrimeBlock, type RangeEnd, type SieveKernelExports, type SieveOptions, type WorkHooks } from '../sieve';

/** A compiled WebAssembly module (opaque here; it can be posted to a worker thread). */
export type KernelModule = object;

// Node has WebAssembly as a global; @types/node 20 does not declare it, so the two constructors used are typed here.
interface WasmGlobal {
  readonly Module: new (bytes: Uint8Array) => KernelModule;
  readonly Instance: new (module: KernelModule, imports: object) => { readonly exports: unknown };
}
const wasm = (globalThis as unknown as { WebAssembly: WasmGlobal }).WebAssembly;

/** Which sieve does the work: the WebAssembly kernel, the JavaScript reference, or the kernel when it is built (`auto`). */
export type SieveKernelChoice = 'auto' | 'wasm' | 'js';

/** Where the built kernel lies: dist/wasm of the engine, whether this module runs from dist or from src (tests). */
export function sieveKernelFile(): string {
  return join(__dirname, '..', '..', 'dist', 'wasm', 'sieve-kernel.wasm');
}

let compiled: KernelModule | null = null;
let instance: SieveKernel | null = null;

/** Whether the kernel has been built (npm run build:node). */
export function sieveKernelBuilt(): boolean {
  return compiled !== null || existsSync(sieveKernelFile());
}

/**
 * The compiled kernel module (compiled once per thread, or handed in by the parent thread with
 * {@link useSieveKernelModule}: a WebAssembly.Module can be posted to a worker, so workers do not
 * compile it again).
 * @throws EngineError(limit) when the kernel has not been built.
 */
export function sieveKernelModule(): KernelModule {
  if (compiled) return compiled;
  const file = sieveKernelFile();
  if (!existsSync(file)) throw new EngineError('limit', `WebAssembly sieve kernel not built (looked for ${file}); run npm run build:node`);
  compiled = new wasm.Module(readFileSync(file));
  return compiled;
}

/** Uses a module compiled elsewhere (the parent thread) for this thread's instance. */
export function useSieveKernelModule(module: KernelModule): void {
  if (!compiled) compiled = module;
}

/** This thread's kernel instance (instantiated on first use). */
export function sieveKernel(): SieveKernel {
  if (!instance) instance = new SieveKernel(new wasm.Instance(sieveKernelModule(), {}).exports as unknown as SieveKernelExports);
  return instance;
}

/** The kernel for a choice: null for `js`, and for `auto` when the kernel is not built. */
export function kernelFor(choice: SieveKernelChoice = 'auto'): SieveKernel | null {
  if (choice === 'js') return null;
  if (choice === 'auto' && !sieveKernelBuilt()) return null;
  return sieveKernel();
}

/**
 * {@link sievePrimeBlock} with the WebAssembly kernel (the same summary; ranges ending at or above
 * 2^40 go to the JavaScript sieve).
 * @throws as sievePrimeBlock; EngineError(limit) when the kernel has not been built.
 */
export function sievePrimeBlockWasm(from: RangeEnd, to: RangeEnd, options: SieveOptions & WorkHooks = {}): PrimeBlock {
  return sievePrimeBlock(from, to, { ...options, kernel: sieveKernel() });
}
