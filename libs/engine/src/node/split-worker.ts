// Worker entry of the split pool: holds the base gap cycle (shared memory) and runs split chunks on request.
import { parentPort, workerData } from 'node:worker_threads';
import { runSplitChunk, splitChunkResultToJson, type SplitChunkSpec } from '../counts/split-counts';

interface SplitWorkerData {
  readonly base: number;
  readonly gaps: SharedArrayBuffer;
}

const data = workerData as SplitWorkerData;
const gaps = new Uint8Array(data.gaps);

parentPort!.on('message', (msg: { id: number; spec: SplitChunkSpec }) => {
  try {
    if (msg.spec.base !== data.base) throw new Error(`worker holds level ${data.base}, chunk needs ${msg.spec.base}`);
    parentPort!.postMessage({ id: msg.id, result: splitChunkResultToJson(runSplitChunk(msg.spec, gaps)) });
  } catch (e) {
    const err = e as Error & { kind?: string };
    parentPort!.postMessage({ id: msg.id, error: { message: err.message, kind: err.kind ?? null } });
  }
});
