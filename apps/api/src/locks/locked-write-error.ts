import type { ApiError, LockedNotebookDetails } from '@cribra/contracts';

/** SQLSTATE raised by the locked-notebook trigger (migration 1796300000000-review-and-locks). */
export const LOCKED_SQLSTATE = 'CRLCK';

/**
 * The API shape of a write the database refused because the notebook is locked (an edit that
 * raced with the lock past the policy check): 409 notebook_locked, like the policy's own refusal.
 * Null for any other error.
 */
export function lockedWriteError(exception: unknown): ApiError | null {
  const e = exception as { code?: string; message?: string; driverError?: { code?: string; message?: string } } | null;
  const code = e?.driverError?.code ?? e?.code;
  if (code !== LOCKED_SQLSTATE) return null;
  const text = e?.driverError?.message ?? e?.message ?? '';
  const notebookId = /notebook ([0-9a-f-]{36}) is locked/.exec(text)?.[1] ?? '';
  const details: LockedNotebookDetails = { reason: 'notebook_locked', notebookId };
  return { statusCode: 409, error: 'Conflict', message: 'This notebook is locked; duplicate it to make changes', details };
}
