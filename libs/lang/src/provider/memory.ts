import type { DataAccess, DataProvider, StoredLedgerRange, StoredLevel, StoredUpload } from './types';

/**
 * Data held in memory, for tests and the command line. It is a synchronous DataAccess (in-process
 * runs); `asProvider()` gives the asynchronous DataProvider a worker pool wants.
 */
export class MemoryDataProvider implements DataAccess {
  private readonly levels = new Map<number, StoredLevel>();
  private readonly ledgers: StoredLedgerRange[] = [];
  private readonly uploads = new Map<string, StoredUpload>();

  addLevel(level: StoredLevel): this {
    this.levels.set(level.prime, level);
    return this;
  }
  addLedgerRange(range: StoredLedgerRange): this {
    this.ledgers.push(range);
    return this;
  }
  addUpload(name: string, upload: StoredUpload): this {
    this.uploads.set(name, upload);
    return this;
  }

  asProvider(): DataProvider {
    return asyncProvider(this);
  }

  level(prime: number): StoredLevel | null {
    return this.levels.get(prime) ?? null;
  }
  ledger(from: bigint, to: bigint): StoredLedgerRange | null {
    return this.ledgers.find((r) => r.from === from && r.to === to) ?? null;
  }
  upload(name: string): StoredUpload | null {
    return this.uploads.get(name) ?? null;
  }
}

/** An async provider view of a synchronous one (values wrapped in resolved promises). */
export function asyncProvider(data: DataAccess): DataProvider {
  return {
    level: async (p) => data.level(p),
    ledger: async (a, b) => data.ledger(a, b),
    upload: async (n) => data.upload(n),
  };
}
