// What the editor needs from the Sift language service, in offsets into the cell source.
// lang-adapter.ts fills it from @cribra/lang; tests fill it by hand.

export type SiftTokenClass = 'keyword' | 'identifier' | 'builtin' | 'number' | 'string' | 'comment' | 'operator' | 'punctuation';

export interface SiftToken {
  offset: number;
  length: number;
  type: SiftTokenClass;
}

export interface SiftCompletion {
  label: string;
  kind: 'function' | 'keyword' | 'variable' | 'constant';
  /** The signature, e.g. `gapcount(g, p) → integer`. */
  detail?: string;
  /** One line of documentation. */
  documentation?: string;
  insertText?: string;
}

export interface SiftDiagnostic {
  message: string;
  severity: 'error' | 'warning' | 'info';
  /** Offsets into the source, end exclusive. */
  start: number;
  end: number;
}

export interface SiftHover {
  /** Markdown. */
  contents: string;
  start: number;
  end: number;
}

export interface SiftLanguageService {
  tokens(source: string): SiftToken[];
  completions(source: string, offset: number): SiftCompletion[];
  diagnostics(source: string): SiftDiagnostic[];
  hover(source: string, offset: number): SiftHover | null;
}
