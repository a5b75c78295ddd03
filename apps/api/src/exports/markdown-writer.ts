import type { NotebookView } from '@cribra/contracts';
import type { DocumentWriter } from './notebook-document';

const fenced = (text: string, lang: string): string => {
  const fence = text.includes('```') ? '~~~~' : '```';
  return `${fence}${lang}\n${text}\n${fence}`;
};

const escCell = (s: string): string => s.replace(/\|/g, '\\|').replace(/\r?\n/g, ' ');

/** Markdown (CommonMark + pipe tables); note cells are Markdown already and pass through. */
export const markdownWriter: DocumentWriter = {
  begin: (nb: NotebookView, stamp?: string) =>
    [
      `# ${nb.title}`,
      nb.summary,
      `*Status: ${nb.status.replace('_', ' ')} · revision ${nb.revision} · owner ${nb.owner.displayName}${nb.tags.length ? ` · tags: ${nb.tags.join(', ')}` : ''} · ${stamp ?? `exported ${new Date().toISOString()}`}*`,
    ]
      .filter(Boolean)
      .join('\n\n'),
  heading: (text, level) => `${'#'.repeat(level)} ${text}`,
  paragraph: (text) => text,
  note: (markdown) => markdown,
  code: (source) => fenced(source, 'sift'),
  value: (text) => fenced(text, ''),
  claims: () => '',
  chart: (o) => {
    const c = o as { title?: unknown; series?: Array<{ name?: string; points?: unknown[] }> };
    const series = (c.series ?? []).map((s) => `${s.name ?? ''} (${s.points?.length ?? 0} points)`).join(', ');
    return `Chart${typeof c.title === 'string' ? `: ${c.title}` : ''} — series ${series || 'none'} (the JSON export of the record holds the data).`;
  },
  table: (columns, rows) =>
    [`| ${columns.map(escCell).join(' | ')} |`, `| ${columns.map(() => '---').join(' | ')} |`, ...rows.map((r) => `| ${r.map(escCell).join(' | ')} |`)].join('\n'),
  meta: (lines) => lines.map((l) => `> ${l}`).join('\n'),
  end: () => '',
};
