// Worker entry of the wheel pool: holds the base gap cycle (shared memory) and runs chunks on request.
import { parentPort, workerData } from 'node:worker_threads';
import { runWheelChunk, type WheelChunkSpec } from '../wheel/chunk';

interface WheelWorkerData {
  readonly base: number;
  readonly gaps: SharedArrayBuffer;
}

const data = workerData as WheelWorkerData;
const gaps = new Uint8Array(data.gaps);

parentPort!.on('message', (msg: { id: number; spec: WheelChunkSpec }) => {
  try {
    if (msg.spec.base !== data.base) throw new Error(`worker holds level ${data.base}, chunk needs ${msg.spec.base}`);
    const t = runWheelChunk(msg.spec, gaps);
    const transfer: ArrayBuffer[] = [t.histogram.buffer as ArrayBuffer, t.firstPosition.buffer as ArrayBuffer];
    if (t.patterns) transfer.push(t.patterns.buffer as ArrayBuffer);
    parentPort!.postMessage({ id: msg.id, tally: t }, transfer);
  } catch (e) {
    const err = e as Error & { kind?: string };
    parentPort!.postMessage({ id: msg.id, error: { message: err.message, kind: err.kind ?? null } });
  }
});
