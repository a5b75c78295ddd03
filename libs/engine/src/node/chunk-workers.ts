import { join, resolve } from 'node:path';
import { Worker } from 'node:worker_threads';
import { EngineError, type EngineErrorKind } from '../errors';
import { wheelGaps } from '../wheel/level-gaps';

/** What a chunk worker posts back: its result under `key`, or the error it stopped on. */
type ChunkReply = { id: number; error?: { message: string; kind: EngineErrorKind | null } } & Record<string, unknown>;

/**
 * Worker file `name` as compiled JavaScript: next to this module in dist, or from the built dist
 * when this module is loaded from TypeScript source (vitest; the libs test setup builds dist first).
 */
export function nodeWorkerFile(name: string): string {
  return __filename.endsWith('.ts') ? resolve(__dirname, `../../dist/node/${name}`) : join(__dirname, name);
}

/**
 * Hands `specs` out one at a time to `workers` threads of `file`, which all share the gap cycle of
 * level `base` (in a SharedArrayBuffer, as `workerData: { base, gaps }`); each worker answers
 * `{ id, [key]: result }` or `{ id, error }`. Results come back in finishing order. A worker's
 * error rejects with an EngineError whose message starts with `describe(spec)`; the threads are
 * always terminated.
 */
export async function runChunksOnWorkers<Spec, Result>(options: {
  file: string;
  base: number;
  specs: readonly Spec[];
  workers: number;
  key: string;
  describe: (spec: Spec) => string;
  onProgress?: (done: number, total: number) => void;
}): Promise<Result[]> {
  const { specs, key } = options;
  const gaps = wheelGaps(options.base);
  const shared = new SharedArrayBuffer(gaps.length);
  new Uint8Array(shared).set(gaps);
  const n = Math.max(1, Math.min(options.workers, specs.length));
  const workers = Array.from({ length: n }, () => new Worker(options.file, { workerData: { base: options.base, gaps: shared } }));
  const parts: Result[] = [];
  let next = 0;
  let done = 0;
  try {
    await Promise.all(
      workers.map(
        (w) =>
          new Promise<void>((resolveAll, reject) => {
            const send = () => {
              if (next >= specs.length) return resolveAll();
              const id = next++;
              w.postMessage({ id, spec: specs[id] });
            };
            w.on('message', (msg: ChunkReply) => {
              if (msg.error) return reject(new EngineError(msg.error.kind ?? 'limit', `${options.describe(specs[msg.id]!)}: ${msg.error.message}`));
              parts.push(msg[key] as Result);
              options.onProgress?.(++done, specs.length);
              send();
            });
            w.on('error', reject);
            send();
          }),
      ),
    );
  } finally {
    await Promise.all(workers.map((w) => w.terminate()));
  }
  return parts;
}
