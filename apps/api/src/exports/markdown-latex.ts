import { Marked, type Token, type Tokens, type TokenizerAndRendererExtension } from 'marked';
import { latexMath, latexText, listingText } from './latex-text';

// The same maths rules as the web app's note view (apps/web/src/components/note/render-note.ts):
// `$$ … $$` on its own lines is display maths, `$ … $` inside a line inline maths; a `$` followed
// by a space, or a closing `$` followed by a digit ("$5"), is not maths.
const blockMath: TokenizerAndRendererExtension = {
  name: 'blockMath',
  level: 'block',
  start: (src) => src.match(/^\$\$/m)?.index,
  tokenizer(src) {
    const m = /^\$\$([\s\S]+?)\$\$[^\n]*(?:\n|$)/.exec(src);
    return m ? { type: 'blockMath', raw: m[0], text: m[1]!.trim() } : undefined;
  },
  renderer: () => '',
};

const inlineMath: TokenizerAndRendererExtension = {
  name: 'inlineMath',
  level: 'inline',
  start: (src) => {
    const i = src.indexOf('$');
    return i < 0 ? undefined : i;
  },
  tokenizer(src) {
    const d = /^\$\$([^$]+?)\$\$/.exec(src);
    if (d) return { type: 'inlineMath', raw: d[0], text: d[1]!, display: true };
    const m = /^\$(?![\s$])((?:\\\$|[^$\n])+?)(?<!\s)\$(?!\d)/.exec(src);
    return m ? { type: 'inlineMath', raw: m[0], text: m[1]!, display: false } : undefined;
  },
  renderer: () => '',
};

const marked = new Marked({ gfm: true, breaks: false, extensions: [blockMath, inlineMath] });

type Tok = Token & { tokens?: Token[]; text?: string };

function inline(tokens: Token[] | undefined): string {
  return (tokens ?? []).map((t) => inlineToken(t as Tok)).join('');
}

function inlineToken(t: Tok): string {
  switch (t.type) {
    case 'text':
      return t.tokens ? inline(t.tokens) : latexText(decodeEntities(t.text ?? ''));
    case 'escape':
      return latexText(t.text ?? '');
    case 'strong':
      return `\\textbf{${inline(t.tokens)}}`;
    case 'em':
      return `\\emph{${inline(t.tokens)}}`;
    case 'del':
      return inline(t.tokens);
    case 'codespan':
      return `\\texttt{${latexText(decodeEntities(t.text ?? ''))}}`;
    case 'br':
      return '\\\\\n';
    case 'link': {
      const l = t as Tokens.Link;
      const text = inline(l.tokens);
      return l.href && l.href !== l.text ? `${text}\\footnote{\\url{${l.href.replace(/[\\{}%#]/g, '')}}}` : `\\url{${l.href.replace(/[\\{}%#]/g, '')}}`;
    }
    case 'image':
      return `[${latexText((t as Tokens.Image).text || 'image')}]`;
    case 'inlineMath':
      return (t as { display?: boolean }).display ? `\\[${latexMath(t.text ?? '')}\\]` : `$${latexMath(t.text ?? '')}$`;
    case 'html':
      return latexText((t as Tokens.HTML).text.replace(/<[^>]*>/g, ''));
    default:
      return latexText((t as { raw?: string }).raw ?? '');
  }
}

function decodeEntities(s: string): string {
  return s.replace(/&(amp|lt|gt|quot|#39);/g, (_, e: string) => ({ amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'" })[e]!);
}

function block(t: Tok): string {
  switch (t.type) {
    case 'space':
    case 'hr':
      return t.type === 'hr' ? '\\par\\noindent\\rule{\\linewidth}{0.4pt}\\par' : '';
    case 'heading': {
      const h = t as Tokens.Heading;
      return `${h.depth <= 2 ? '\\subsubsection*' : '\\paragraph*'}{${inline(h.tokens)}}`;
    }
    case 'paragraph':
      return inline(t.tokens);
    case 'text':
      return t.tokens ? inline(t.tokens) : latexText(t.text ?? '');
    case 'blockMath':
      return `\\[${latexMath(t.text ?? '')}\\]`;
    case 'code':
      return `\\begin{lstlisting}[style=plain]\n${listingText((t as Tokens.Code).text).replace(/\\end\{lstlisting\}/g, '\\end {lstlisting}')}\n\\end{lstlisting}`;
    case 'blockquote':
      return `\\begin{quote}\n${blocks((t as Tokens.Blockquote).tokens)}\n\\end{quote}`;
    case 'list': {
      const l = t as Tokens.List;
      const env = l.ordered ? 'enumerate' : 'itemize';
      const items = l.items.map((i) => `\\item ${blocks(i.tokens)}`).join('\n');
      return items ? `\\begin{${env}}\n${items}\n\\end{${env}}` : '';
    }
    case 'table': {
      const tb = t as Tokens.Table;
      const spec = tb.align.map((a) => (a === 'right' ? 'r' : a === 'center' ? 'c' : 'l')).join('');
      const row = (cells: Tokens.TableCell[]): string => `${cells.map((c) => inline(c.tokens)).join(' & ')} \\\\`;
      return [`\\begin{longtable}{${spec}}`, row(tb.header), '\\hline', ...tb.rows.map(row), '\\end{longtable}'].join('\n');
    }
    case 'html':
      return latexText((t as Tokens.HTML).text.replace(/<[^>]*>/g, ''));
    default:
      return latexText((t as { raw?: string }).raw ?? '');
  }
}

function blocks(tokens: Token[]): string {
  return tokens.map((t) => block(t as Tok)).filter(Boolean).join('\n\n');
}

/**
 * A note cell's Markdown as LaTeX: headings, emphasis, lists, quotes, code, tables and links
 * converted; `$…$` and `$$…$$` kept as maths (their Unicode symbols mapped for pdflatex).
 */
export function markdownToLatex(markdown: string): string {
  try {
    return blocks(marked.lexer(markdown));
  } catch {
    // Pathological nesting overflows the Markdown parser (as in the web app): the text as written.
    return latexText(markdown);
  }
}
