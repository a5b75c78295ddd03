// Language service for the editor: plain functions over the source text.
export { tokenize, type SiftToken, type TokenKind } from './tokens';
export { diagnose, type Diagnostic } from './diagnostics';
export { complete, hover, definedNames, type Completion, type HoverInfo } from './completions';
export { KEYWORD_DOCS, KEYWORDS } from './keywords';
