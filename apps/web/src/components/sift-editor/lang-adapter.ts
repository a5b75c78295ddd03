import { complete, diagnose, hover, tokenize, type TokenKind } from '@cribra/lang';
import type { SiftLanguageService, SiftTokenClass } from './sift-service';

// Maps the @cribra/lang language service (plain functions over the source) to the editor's needs.

const TOKEN_CLASS: Record<TokenKind, SiftTokenClass | null> = {
  keyword: 'keyword',
  builtin: 'builtin',
  name: 'identifier',
  number: 'number',
  string: 'string',
  operator: 'operator',
  punctuation: 'punctuation',
  comment: 'comment',
  invalid: null,
};

export const siftService: SiftLanguageService = {
  tokens: (source) =>
    tokenize(source).flatMap((t) => {
      const type = TOKEN_CLASS[t.kind];
      return type ? [{ offset: t.offset, length: t.length, type }] : [];
    }),
  completions: (source, offset) =>
    complete(source, offset).map((c) => ({
      label: c.label,
      kind: c.kind === 'option' ? 'constant' : c.kind,
      detail: c.detail,
      documentation: c.documentation,
      insertText: c.insertText,
    })),
  diagnostics: (source) =>
    diagnose(source).map((d) => ({
      message: d.message,
      severity: d.severity,
      start: d.offset,
      end: d.offset + Math.max(1, d.length),
    })),
  hover: (source, offset) => {
    const h = hover(source, offset);
    if (!h) return null;
    const [signature, ...rest] = h.contents;
    return { contents: [`\`${signature}\``, ...rest].join('\n\n'), start: h.offset, end: h.offset + h.length };
  },
};
