/** Where something sits in a cell's source: 0-based offset, 1-based line and column, length in characters. */
export interface SourceSpan {
  offset: number;
  line: number;
  column: number;
  length: number;
}

/**
 * Kinds of Sift failure:
 * - syntax: the text is not a Sift program;
 * - type: a value of the wrong kind (a tuple where an integer was needed, an unknown name, wrong arity);
 * - domain: the right kind of value outside the function's domain (a non-admissible tuple, a level that is not prime);
 * - limit: a step, time, memory, size or nesting limit was reached;
 * - cancelled: the run was stopped from outside.
 */
export type SiftErrorKind = 'syntax' | 'type' | 'domain' | 'limit' | 'cancelled';

export const SIFT_ERROR_KINDS: readonly SiftErrorKind[] = ['syntax', 'type', 'domain', 'limit', 'cancelled'];

/** How each kind of error is introduced wherever a run's error is shown ("Domain error: …"). */
export const ERROR_TITLES: Readonly<Record<SiftErrorKind | 'internal', string>> = {
  syntax: 'Syntax error',
  type: 'Type error',
  domain: 'Domain error',
  limit: 'Limit reached',
  cancelled: 'Cancelled',
  internal: 'Internal error',
};

/** The title of an error kind; an unknown kind is named as it is, never left blank. */
export function errorTitle(kind: string): string {
  return (ERROR_TITLES as Record<string, string>)[kind] ?? `Error (${kind})`;
}

/** The one error type of the language; every failure a user can cause is one of these. */
export class SiftError extends Error {
  override readonly name = 'SiftError';
  constructor(
    readonly kind: SiftErrorKind,
    message: string,
    readonly span?: SourceSpan,
  ) {
    super(message);
  }

  /** Plain-data form for JSON (positions 1-based). */
  toJSON(): SiftErrorJson {
    const out: SiftErrorJson = { kind: this.kind, message: this.message };
    if (this.span) {
      out.line = this.span.line;
      out.column = this.span.column;
      out.offset = this.span.offset;
      out.length = this.span.length;
    }
    return out;
  }
}

export interface SiftErrorJson {
  kind: SiftErrorKind;
  message: string;
  line?: number;
  column?: number;
  offset?: number;
  length?: number;
}

export const syntaxError = (message: string, span?: SourceSpan) => new SiftError('syntax', message, span);
export const typeError = (message: string, span?: SourceSpan) => new SiftError('type', message, span);
export const domainError = (message: string, span?: SourceSpan) => new SiftError('domain', message, span);
export const limitError = (message: string, span?: SourceSpan) => new SiftError('limit', message, span);

export function isSiftError(e: unknown): e is SiftError {
  return e instanceof SiftError;
}
