import type { LockRecord, LockedCell } from '@cribra/contracts';
import { withRecordSha256 } from './record-hash';

/** What notebook_locks.record holds: a v1 record, or one written before v1 (no recordVersion). */
type StoredRecord = LockRecord | (Omit<LockRecord, 'recordVersion' | 'recordSha256' | 'summary' | 'tags' | 'authors' | 'uploads' | 'cells'> & {
  recordVersion?: undefined;
  cells: Array<Omit<LockedCell, 'title' | 'cellRevision' | 'outputs' | 'outputsComplete' | 'outputsBytes' | 'claims' | 'uploadsRead'>>;
});

/**
 * A stored lock record in the v1 shape. Records locked before v1 (which held sources and digests
 * only) are read as 'cribra-record-v0' with the missing parts empty (no titles, outputs, claims or
 * uploads) and their hash computed here; the stored row itself never changes (the lock trigger).
 */
export function upgradeLockRecord(stored: StoredRecord): LockRecord {
  if (stored.recordVersion) return stored as LockRecord;
  return withRecordSha256({
    ...stored,
    recordVersion: 'cribra-record-v0',
    summary: '',
    tags: [],
    authors: [],
    uploads: [],
    cells: stored.cells.map((c) => ({
      ...c,
      title: null,
      cellRevision: null,
      outputs: null,
      outputsComplete: false,
      outputsBytes: 0,
      claims: [],
      uploadsRead: [],
    })),
  });
}
