// Public surface of @cribra/lang (browser-safe: no node modules here; see ./node for the pool).
export { LANG_VERSION } from './version';
export * from './errors';
export { parse, MAX_SOURCE_LENGTH, type ParseResult } from './syntax/parse';
export type { Program, Stmt, Expr, Binder } from './syntax/ast';
export { evaluate, type RunOptions, type RunResult, type RunErrorJson } from './evaluate';
export { DEFAULT_LIMITS, resolveLimits, type Limits } from './runtime/limits';
export * from './outputs/types';
export { outputsDigest, DIGEST_VERSION } from './outputs/digest';
export { canonicalJson } from './outputs/canonical-json';
export { valueJsonText, type ValueTextOptions } from './outputs/value-text';
export { groupInteger, statesMoreThanChecked, verdictSentence, type VerdictContext } from './outputs/verdict-text';
export { sha256Hex, sha256HexOfText } from './outputs/sha256';
export { jsonToNumber } from './values/to-json';
export * from './provider/types';
export { MemoryDataProvider, asyncProvider } from './provider/memory';
export { allBuiltins, type Builtin, type BuiltinArea } from './builtins/registry';
export * from './service';
export {
  parseNotebookFile, formatNotebookFile,
  type NotebookFile, type NotebookFileCell, type NotebookCellKind, type ParsedNotebookFile, type NotebookFileError,
} from './notebook/file';
export {
  exprToLatex, statementToLatex, claimsToLatex, nameToLatex, GREEK_LATEX,
  type ClaimLatex, type LatexOptions,
} from './syntax/latex';
