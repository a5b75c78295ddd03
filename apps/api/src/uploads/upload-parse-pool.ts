import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { Injectable, OnModuleDestroy } from '@nestjs/common';
import { Piscina } from 'piscina';
import type { UploadKind } from '@cribra/contracts';
import type { ParseOutcome } from './upload-parser';

/**
 * The compiled worker. Under Jest this file runs from src (.ts) and Node cannot load a .ts worker,
 * so the build's copy in dist is used (`npx tsc -b`, which the launcher runs before the tests).
 */
function workerFile(): string {
  const here = join(__dirname, 'upload-parse.worker.js');
  if (existsSync(here)) return here;
  return join(__dirname, '..', '..', 'dist', 'uploads', 'upload-parse.worker.js');
}

/**
 * Parses uploads in a worker thread (one, or two on machines with more cores): a 2 MB CSV of
 * 10^6 rows took the API's event loop for about 5 s when parsed on the request thread, holding up
 * every other request; in the worker only the upload itself waits.
 */
@Injectable()
export class UploadParsePool implements OnModuleDestroy {
  private pool: Piscina | null = null;

  private get workers(): Piscina {
    this.pool ??= new Piscina({ filename: workerFile(), minThreads: 0, maxThreads: 2, idleTimeout: 60_000 });
    return this.pool;
  }

  /** `null`: the bytes are not UTF-8 text. */
  parse(kind: UploadKind, bytes: Buffer): Promise<ParseOutcome | null> {
    return this.workers.run({ kind, bytes: new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength) });
  }

  async onModuleDestroy(): Promise<void> {
    await this.pool?.destroy();
    this.pool = null;
  }
}
