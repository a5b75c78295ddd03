import type { NotebookView } from '@cribra/contracts';
import type { DocumentWriter } from './notebook-document';

const escCell = (s: string): string => s.replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');

/** Markdown (CommonMark + pipe tables); note cells are Markdown already and pass through. */
export const markdownWriter: DocumentWriter = {
  begin: (nb: NotebookView) =>
    [
      `# ${nb.title}`,
      nb.summary,
      `*Status: ${nb.status.replace('_', ' ')} · revision ${nb.revision} · owner ${nb.owner.displayName}${nb.tags.length ? ` · tags: ${nb.tags.join(', ')}` : ''} · exported ${new Date().toISOString()}*`,
    ]
      .filter(Boolean)
      .join('\n\n'),
  heading: (text, level) => `${'#'.repeat(level)} ${text}`,
  paragraph: (text) => text,
  code: (source) => {
    const fence = source.includes('```') ? '~~~~' : '```';
    return `${fence}sift\n${source}\n${fence}`;
  },
  table: (columns, rows) =>
    [`| ${columns.map(escCell).join(' | ')} |`, `| ${columns.map(() => '---').join(' | ')} |`, ...rows.map((r) => `| ${r.map(escCell).join(' | ')} |`)].join('\n'),
  meta: (lines) => lines.map((l) => `> ${l}`).join('\n'),
  end: () => '',
};
