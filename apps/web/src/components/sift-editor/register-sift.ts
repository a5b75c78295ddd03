import type * as Monaco from 'monaco-editor/editor/editor.api';
import { lineTokens } from './monaco-tokens';
import type { SiftLanguageService } from './sift-service';

export const SIFT_LANGUAGE_ID = 'sift';
export const SIFT_MARKER_OWNER = 'sift';

type MonacoApi = typeof Monaco;

const KIND = (m: MonacoApi) => ({
  function: m.languages.CompletionItemKind.Function,
  keyword: m.languages.CompletionItemKind.Keyword,
  variable: m.languages.CompletionItemKind.Variable,
  constant: m.languages.CompletionItemKind.Constant,
});

const SEVERITY = (m: MonacoApi) => ({
  error: m.MarkerSeverity.Error,
  warning: m.MarkerSeverity.Warning,
  info: m.MarkerSeverity.Info,
});

class LineState implements Monaco.languages.IState {
  clone() {
    return this;
  }
  equals(other: Monaco.languages.IState) {
    return other === this;
  }
}
const STATE = new LineState();

/** Registers the Sift language once per Monaco instance: tokens, completion, hover, brackets, comments. */
export function registerSift(monaco: MonacoApi, service: SiftLanguageService): void {
  if (monaco.languages.getLanguages().some((l) => l.id === SIFT_LANGUAGE_ID)) return;
  monaco.languages.register({ id: SIFT_LANGUAGE_ID, extensions: ['.sift'], aliases: ['Sift'] });
  monaco.languages.setLanguageConfiguration(SIFT_LANGUAGE_ID, {
    comments: { lineComment: '//' },
    brackets: [['(', ')'], ['[', ']'], ['{', '}']],
    autoClosingPairs: [
      { open: '(', close: ')' },
      { open: '[', close: ']' },
      { open: '{', close: '}' },
      { open: '"', close: '"' },
    ],
  });
  monaco.languages.setTokensProvider(SIFT_LANGUAGE_ID, {
    getInitialState: () => STATE,
    tokenize: (line) => ({ tokens: lineTokens(line, service.tokens(line)), endState: STATE }),
  });
  monaco.languages.registerCompletionItemProvider(SIFT_LANGUAGE_ID, {
    triggerCharacters: ['.'],
    provideCompletionItems(model, position) {
      const word = model.getWordUntilPosition(position);
      const range = new monaco.Range(position.lineNumber, word.startColumn, position.lineNumber, word.endColumn);
      const kinds = KIND(monaco);
      const items = service.completions(model.getValue(), model.getOffsetAt(position));
      return {
        suggestions: items.map((c) => ({
          label: c.label,
          kind: kinds[c.kind],
          detail: c.detail,
          documentation: c.documentation ? { value: c.documentation } : undefined,
          insertText: c.insertText ?? c.label,
          range,
        })),
      };
    },
  });
  monaco.languages.registerHoverProvider(SIFT_LANGUAGE_ID, {
    provideHover(model, position) {
      const h = service.hover(model.getValue(), model.getOffsetAt(position));
      if (!h) return null;
      const s = model.getPositionAt(h.start);
      const e = model.getPositionAt(h.end);
      return { contents: [{ value: h.contents }], range: new monaco.Range(s.lineNumber, s.column, e.lineNumber, e.column) };
    },
  });
}

/** Replaces the Sift markers of a model with the service's diagnostics. */
export function updateDiagnostics(monaco: MonacoApi, model: Monaco.editor.ITextModel, service: SiftLanguageService): void {
  const severity = SEVERITY(monaco);
  const markers = service.diagnostics(model.getValue()).map((d) => {
    const s = model.getPositionAt(d.start);
    const e = model.getPositionAt(Math.max(d.end, d.start + 1));
    return {
      message: d.message,
      severity: severity[d.severity],
      startLineNumber: s.lineNumber,
      startColumn: s.column,
      endLineNumber: e.lineNumber,
      endColumn: e.column,
    };
  });
  monaco.editor.setModelMarkers(model, SIFT_MARKER_OWNER, markers);
}
