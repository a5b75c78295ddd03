import type { DataAccess, DataProvider, StoredLedgerRange, StoredLevel, StoredUpload } from '@cribra/lang';

type Request = { method: 'level'; prime: number } | { method: 'ledger'; from: bigint; to: bigint } | { method: 'upload'; name: string };

const keyOf = (r: Request): string =>
  r.method === 'level' ? `level:${r.prime}` : r.method === 'ledger' ? `ledger:${r.from}:${r.to}` : `upload:${r.name}`;

/**
 * A synchronous DataAccess over an asynchronous DataProvider for in-thread evaluation: it answers
 * from a cache and records what was missing; the caller fetches the misses and evaluates again.
 * Sift is deterministic, so the final pass (with no misses) is exactly the run with the data.
 */
export class PrefetchDataAccess implements DataAccess {
  private readonly cache = new Map<string, unknown>();
  private misses: Request[] = [];

  constructor(private readonly provider: DataProvider) {}

  private get<T>(r: Request): T | null {
    const k = keyOf(r);
    if (this.cache.has(k)) return this.cache.get(k) as T | null;
    if (!this.misses.some((m) => keyOf(m) === k)) this.misses.push(r);
    return null;
  }

  level(prime: number): StoredLevel | null {
    return this.get({ method: 'level', prime });
  }
  ledger(from: bigint, to: bigint): StoredLedgerRange | null {
    return this.get({ method: 'ledger', from, to });
  }
  upload(name: string): StoredUpload | null {
    return this.get({ method: 'upload', name });
  }

  /** Fetches what the last pass missed; returns false when nothing was missing. */
  async fill(): Promise<boolean> {
    const misses = this.misses;
    this.misses = [];
    if (!misses.length) return false;
    for (const r of misses) {
      const value =
        r.method === 'level' ? await this.provider.level(r.prime) : r.method === 'ledger' ? await this.provider.ledger(r.from, r.to) : await this.provider.upload(r.name);
      this.cache.set(keyOf(r), value);
    }
    return true;
  }
}
