/** Kinds of engine failure: bad user input, a mathematical domain violation, or a size/time limit. */
export type EngineErrorKind = 'input' | 'domain' | 'limit';

/**
 * The one error type the engine throws. Its message names the offending values so that the
 * command line and the cell language can show it as is.
 */
export class EngineError extends Error {
  override readonly name = 'EngineError';
  constructor(
    readonly kind: EngineErrorKind,
    message: string,
  ) {
    super(message);
  }
}

export const inputError = (message: string) => new EngineError('input', message);
export const domainError = (message: string) => new EngineError('domain', message);
export const limitError = (message: string) => new EngineError('limit', message);
