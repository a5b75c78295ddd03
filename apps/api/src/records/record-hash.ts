import { createHash } from 'node:crypto';
import { canonicalJson } from '@cribra/lang';
import { RECORD_ID_LENGTH, type LockRecord } from '@cribra/contracts';

const HEX64 = /^[0-9a-f]{64}$/;

/**
 * The record's SHA-256: the hash the record states about itself (`recordSha256`, the SHA-256 of its
 * canonical form, see docs/records.md) when it holds one, else the SHA-256 of its canonical JSON.
 */
export function recordSha256(record: LockRecord): string {
  const own = (record as unknown as { recordSha256?: unknown }).recordSha256;
  if (typeof own === 'string' && HEX64.test(own)) return own;
  return createHash('sha256').update(canonicalJson(record), 'utf8').digest('hex');
}

/** The public id: the first RECORD_ID_LENGTH hex digits of the record's hash. */
export const recordIdOf = (sha256: string): string => sha256.slice(0, RECORD_ID_LENGTH);

/** Shape of a public id (anything else is answered like an unknown id). */
export const RECORD_ID = new RegExp(`^[0-9a-f]{${RECORD_ID_LENGTH}}$`);
