// Worker-thread entry of the Sift pool (loaded by piscina from dist/node/worker.js).
import type { MessagePort } from 'node:worker_threads';
import { evaluate, type RunResult } from '../evaluate';
import { WorkerDataAccess } from './bridge';
import type { WorkerMessage, WorkerTask } from './protocol';

export default function runTask(task: WorkerTask): RunResult {
  const port = task.port;
  const data = task.hasData && port && task.flag ? new WorkerDataAccess(port, task.flag) : null;
  const onProgress = port
    ? (fraction: number, message: string) => port.postMessage({ type: 'progress', fraction, message } satisfies WorkerMessage)
    : undefined;
  try {
    return evaluate(task.source, { limits: task.limits, data, onProgress });
  } finally {
    port?.close();
  }
}
