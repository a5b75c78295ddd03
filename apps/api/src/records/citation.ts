import type { RecordCitation, UserRef } from '@cribra/contracts';

export interface CitationInput {
  id: string;
  title: string;
  authors: UserRef[];
  reviewers: UserRef[];
  /** When the notebook was locked (the record's date). */
  lockedAt: string;
  url: string;
  recordSha256: string;
}

const MONTHS = ['jan', 'feb', 'mar', 'apr', 'may', 'jun', 'jul', 'aug', 'sep', 'oct', 'nov', 'dec'];

// BibTeX values sit inside braces: balance is all that matters, so braces are dropped and \ is escaped.
const bib = (s: string): string => s.replace(/[{}]/g, '').replace(/\\/g, '\\textbackslash{}').replace(/([&%#$_])/g, '\\$1');

const names = (people: UserRef[]): string => {
  const n = people.map((p) => p.displayName);
  return n.length <= 2 ? n.join(' and ') : `${n.slice(0, -1).join(', ')} and ${n[n.length - 1]}`;
};

/** A BibTeX entry and a plain-text reference: title, authors, reviewers, date, address, record hash. */
export function citationOf(c: CitationInput): RecordCitation {
  const date = c.lockedAt.slice(0, 10);
  const [year, month] = date.split('-');
  const reviewers = c.reviewers.length ? `reviewed by ${names(c.reviewers)}` : 'no reviewers recorded';
  const bibtex = [
    `@misc{cribra-${c.id},`,
    `  title        = {${bib(c.title)}},`,
    `  author       = {${c.authors.map((a) => bib(a.displayName)).join(' and ')}},`,
    `  year         = {${year}},`,
    `  month        = ${MONTHS[Number(month) - 1] ?? 'jan'},`,
    `  howpublished = {Cribra locked record, ${bib(reviewers)}},`,
    `  url          = {${c.url}},`,
    `  note         = {Record SHA-256 ${c.recordSha256}; locked ${date}},`,
    '}',
  ].join('\n');
  const text = `${names(c.authors)}. ${c.title}. Cribra locked record, ${reviewers}, ${date}. ${c.url} (record SHA-256 ${c.recordSha256}).`;
  return { bibtex, text };
}
