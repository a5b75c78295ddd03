import type { ApiError } from '@cribra/contracts';

/** A field message from a 400 validation refusal, keyed by the body field it concerns. */
export type FieldErrors = Record<string, string>;

/**
 * The typed form of the shared error shape `{statusCode, error, message, details?}`.
 * Thrown by the API client for every non-2xx answer, and for network failures (statusCode 0).
 */
export class ApiRequestError extends Error {
  readonly statusCode: number;
  readonly error: string;
  readonly details: unknown;

  constructor(body: ApiError) {
    super(body.message);
    this.name = 'ApiRequestError';
    this.statusCode = body.statusCode;
    this.error = body.error;
    this.details = body.details;
  }

  /** Field messages from a validation error, whatever form `details` takes (array or map). */
  get fieldErrors(): FieldErrors {
    return toFieldErrors(this.details);
  }

  get isUnauthorized(): boolean {
    return this.statusCode === 401;
  }

  get isNetwork(): boolean {
    return this.statusCode === 0;
  }
}

function toFieldErrors(details: unknown): FieldErrors {
  const out: FieldErrors = {};
  if (Array.isArray(details)) {
    for (const d of details) {
      if (d && typeof d === 'object' && 'field' in d) {
        const { field, message, messages } = d as { field: string; message?: string; messages?: string[] };
        out[field] = message ?? (messages ?? []).join('; ');
      }
    }
  } else if (details && typeof details === 'object') {
    for (const [field, value] of Object.entries(details as Record<string, unknown>)) {
      if (typeof value === 'string') out[field] = value;
      else if (Array.isArray(value)) out[field] = value.filter((v) => typeof v === 'string').join('; ');
    }
  }
  return out;
}

/** True when a value has the shared error shape (so a proxy's HTML error page is not mistaken for it). */
export function isApiErrorBody(value: unknown): value is ApiError {
  return (
    !!value &&
    typeof value === 'object' &&
    typeof (value as ApiError).statusCode === 'number' &&
    typeof (value as ApiError).message === 'string'
  );
}

/** A short human message for any thrown value, for error banners. */
export function errorMessage(err: unknown): string {
  if (err instanceof ApiRequestError) return err.message;
  if (err instanceof Error) return err.message;
  return 'Something went wrong.';
}
