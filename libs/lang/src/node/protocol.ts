import type { MessagePort } from 'node:worker_threads';
import type { Limits } from '../runtime/limits';
import type { DataMethod } from '../provider/types';

/** What the pool sends a worker thread for one run. */
export interface WorkerTask {
  source: string;
  limits: Partial<Limits>;
  /** Port for progress reports and data requests (transferred to the worker). */
  port: MessagePort | null;
  /** Shared flag the host raises when a data reply is on the port (the worker waits on it). */
  flag: SharedArrayBuffer | null;
  hasData: boolean;
}

/** Worker → host. */
export type WorkerMessage =
  | { type: 'progress'; fraction: number; message: string }
  | { type: 'data'; id: number; method: DataMethod; args: unknown[] };

/** Host → worker, answering one data request. */
export type DataReply = { type: 'data-reply'; id: number; ok: true; value: unknown } | { type: 'data-reply'; id: number; ok: false; message: string };
