import { type MessagePort, receiveMessageOnPort } from 'node:worker_threads';
import { limitError, SiftError } from '../errors';
import type { DataAccess, DataMethod, DataProvider, StoredLedgerRange, StoredLevel, StoredUpload } from '../provider/types';
import type { DataReply, WorkerMessage } from './protocol';

/** Longest wait of a worker for one answer of the host's data provider. */
export const DATA_WAIT_MS = 30_000;

/**
 * The worker side of the data bridge: a synchronous DataAccess that posts each request to the host
 * and blocks on a shared flag (Atomics.wait) until the host has posted the reply, then takes the
 * reply off the port with receiveMessageOnPort. The interpreter stays synchronous and
 * deterministic; only the data lookups cross threads.
 */
export class WorkerDataAccess implements DataAccess {
  private nextId = 1;
  private readonly flag: Int32Array;

  constructor(
    private readonly port: MessagePort,
    flag: SharedArrayBuffer,
  ) {
    this.flag = new Int32Array(flag);
  }

  level(prime: number): StoredLevel | null {
    return this.ask('level', [prime]) as StoredLevel | null;
  }
  ledger(from: bigint, to: bigint): StoredLedgerRange | null {
    return this.ask('ledger', [from, to]) as StoredLedgerRange | null;
  }
  upload(name: string): StoredUpload | null {
    return this.ask('upload', [name]) as StoredUpload | null;
  }

  private ask(method: DataMethod, args: unknown[]): unknown {
    const id = this.nextId++;
    Atomics.store(this.flag, 0, 0);
    const msg: WorkerMessage = { type: 'data', id, method, args };
    this.port.postMessage(msg);
    const waited = Atomics.wait(this.flag, 0, 0, DATA_WAIT_MS);
    if (waited === 'timed-out') throw limitError(`stored data did not arrive within ${DATA_WAIT_MS / 1000} s`);
    const got = receiveMessageOnPort(this.port);
    const reply = got?.message as DataReply | undefined;
    if (!reply || reply.id !== id) throw new SiftError('domain', 'stored data: the host answered out of order');
    if (!reply.ok) throw new SiftError('domain', `stored data unavailable: ${reply.message}`);
    return reply.value;
  }
}

/** The host side: answers a worker's data requests from an asynchronous provider. */
export function serveData(port: MessagePort, flag: SharedArrayBuffer, provider: DataProvider, onProgress?: (f: number, m: string) => void): void {
  const signal = new Int32Array(flag);
  port.on('message', (msg: WorkerMessage) => {
    if (msg.type === 'progress') {
      onProgress?.(msg.fraction, msg.message);
      return;
    }
    void answer(msg.id, msg.method, msg.args);
  });
  const answer = async (id: number, method: DataMethod, args: unknown[]) => {
    let reply: DataReply;
    try {
      const fn = provider[method] as (...a: unknown[]) => Promise<unknown>;
      reply = { type: 'data-reply', id, ok: true, value: await fn.apply(provider, args) };
    } catch (e) {
      reply = { type: 'data-reply', id, ok: false, message: e instanceof Error ? e.message : String(e) };
    }
    port.postMessage(reply);
    Atomics.store(signal, 0, 1);
    Atomics.notify(signal, 0);
  };
}
