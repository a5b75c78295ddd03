import { createHash } from 'node:crypto';
import { canonicalJson } from '@cribra/lang';
import type { LockRecord } from '@cribra/contracts';

/**
 * The record's own hash: hex SHA-256 of the UTF-8 canonical JSON (keys sorted by UTF-16 code
 * units, no whitespace; @cribra/lang canonicalJson) of the record without `recordSha256`.
 * `cribra verify` computes the same (docs/records.md).
 */
export function lockRecordSha256(record: Omit<LockRecord, 'recordSha256'> & { recordSha256?: string }): string {
  const { recordSha256: _drop, ...rest } = record;
  return createHash('sha256').update(canonicalJson(rest), 'utf8').digest('hex');
}

/** The record with its hash filled in. */
export function withRecordSha256(record: Omit<LockRecord, 'recordSha256'>): LockRecord {
  return { ...record, recordSha256: lockRecordSha256(record) };
}
