import escapeHtml from 'escape-html';

/** One mail's content, written once and rendered as plain text and as HTML. */
export interface MailContent {
  greeting: string;
  /** Paragraphs before the link (plain text; escaped in the HTML part). */
  intro: string[];
  /** Quoted text (a note, a comment excerpt), shown as a block quote. */
  quote?: string;
  link: { href: string; label: string };
  /** Paragraphs after the link. */
  outro: string[];
}

export interface ComposedMail {
  text: string;
  html: string;
}

const paragraph = (p: string) => `<p style="margin:0 0 12px">${escapeHtml(p).replace(/\n/g, '<br>')}</p>`;

/**
 * Renders a mail as a text part and an HTML part with the same words: most mail readers show the
 * HTML part, where the link is a button-like anchor; the text part keeps the bare address so that
 * it can be copied. No images, no remote styles (nothing loads from elsewhere).
 */
export function composeMail(c: MailContent): ComposedMail {
  const text = [
    c.greeting,
    '',
    ...c.intro.flatMap((p) => [p, '']),
    ...(c.quote ? [c.quote.split('\n').map((l) => `> ${l}`).join('\n'), ''] : []),
    `${c.link.label}: ${c.link.href}`,
    '',
    ...c.outro.flatMap((p) => [p, '']),
  ].join('\n');
  const href = escapeHtml(c.link.href);
  const html = [
    '<!doctype html><html><body style="font-family:sans-serif;font-size:15px;line-height:1.5;color:#1f1d1a;background:#f6f3ec;padding:16px">',
    '<div style="max-width:560px;margin:0 auto;background:#fffdf8;border:1px solid #ddd6c8;border-radius:6px;padding:20px">',
    paragraph(c.greeting),
    ...c.intro.map(paragraph),
    c.quote ? `<blockquote style="margin:0 0 12px;padding:8px 12px;border-left:3px solid #ddd6c8;color:#4a463f">${escapeHtml(c.quote).replace(/\n/g, '<br>')}</blockquote>` : '',
    `<p style="margin:16px 0"><a href="${href}" style="display:inline-block;background:#1f5f57;color:#ffffff;text-decoration:none;padding:10px 16px;border-radius:4px">${escapeHtml(c.link.label)}</a></p>`,
    `<p style="margin:0 0 12px;font-size:13px;color:#4a463f">Or paste this address into your browser: <a href="${href}">${href}</a></p>`,
    ...c.outro.map(paragraph),
    '</div></body></html>',
  ].join('\n');
  return { text, html };
}
