import DOMPurify from 'dompurify';
import katex from 'katex';
import { Marked, type TokenizerAndRendererExtension } from 'marked';

const tex = (text: string, displayMode: boolean) =>
  katex.renderToString(text, { displayMode, throwOnError: false, output: 'htmlAndMathml', trust: false });

// `$$ … $$` on its own lines: display maths.
const blockMath: TokenizerAndRendererExtension = {
  name: 'blockMath',
  level: 'block',
  start: (src) => src.match(/^\$\$/m)?.index,
  tokenizer(src) {
    const m = /^\$\$([\s\S]+?)\$\$[^\n]*(?:\n|$)/.exec(src);
    if (m) return { type: 'blockMath', raw: m[0], text: m[1].trim() };
    return undefined;
  },
  renderer: (token) => `<div class="note-math">${tex(token.text as string, true)}</div>`,
};

/** Where an inline extension may begin: the first `ch` in the source, if any. */
const startAt = (ch: string) => (src: string): number | undefined => {
  const i = src.indexOf(ch);
  return i < 0 ? undefined : i;
};

// `$ … $` inside a line: inline maths. A `$` followed by a space or a digit run like "$5" is not maths.
const inlineMath: TokenizerAndRendererExtension = {
  name: 'inlineMath',
  level: 'inline',
  start: startAt('$'),
  tokenizer(src) {
    // `$$ … $$` inside a line of text: display maths in place.
    const d = /^\$\$([^$]+?)\$\$/.exec(src);
    if (d) return { type: 'inlineMath', raw: d[0], text: d[1], display: true };
    const m = /^\$(?![\s$])((?:\\\$|[^$\n])+?)(?<!\s)\$(?!\d)/.exec(src);
    if (m) return { type: 'inlineMath', raw: m[0], text: m[1], display: false };
    return undefined;
  },
  renderer: (token) => tex(token.text as string, token.display === true),
};

const marked = new Marked({ gfm: true, breaks: false, extensions: [blockMath, inlineMath] });

const escapeHtml = (text: string) =>
  text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');

// `@Display Name` of a mentioned person: a highlighted span. Only the names given match (longest
// first), not followed by a letter or digit; code spans and maths are tokenised before and stay as they are.
function mentionExtension(names: string[]): TokenizerAndRendererExtension {
  const sorted = [...new Set(names.filter((n) => n.trim()))].sort((a, b) => b.length - a.length);
  return {
    name: 'mention',
    level: 'inline',
    start: startAt('@'),
    tokenizer(src) {
      if (src[0] !== '@') return undefined;
      const name = sorted.find((n) => src.startsWith(n, 1) && !/[\p{L}\p{N}]/u.test(src.charAt(n.length + 1)));
      return name === undefined ? undefined : { type: 'mention', raw: `@${name}`, text: name };
    },
    renderer: (token) => `<span class="mention">@${escapeHtml(token.text as string)}</span>`,
  };
}

const withMentions = (names: string[]) =>
  new Marked({ gfm: true, breaks: false, extensions: [blockMath, inlineMath, mentionExtension(names)] });

/**
 * A note cell's Markdown with TeX maths as sanitised HTML. Everything the author wrote passes
 * through DOMPurify after rendering, so raw HTML in a note cannot run script.
 * `mentions`: display names whose `@Name` is highlighted (comments); the result is sanitised the same way.
 */
export function renderNote(markdown: string, mentions: string[] = []): string {
  let html: string;
  try {
    html = (mentions.length ? withMentions(mentions) : marked).parse(markdown, { async: false });
  } catch {
    // Thousands of nested `>` or list levels overflow the Markdown parser's stack: show the text
    // as written instead of failing the whole page for everyone who opens the note or comment.
    html = `<pre>${markdown.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;')}</pre>`;
  }
  // No forms: a note must not be able to imitate a sign-in or any other input form.
  return DOMPurify.sanitize(html, { USE_PROFILES: { html: true, mathMl: true, svg: true }, ADD_ATTR: ['target'], FORBID_TAGS: ['form'] });
}
