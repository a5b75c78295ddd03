import { mailApiUrl } from './env';

interface MaildevMessage {
  subject: string;
  to: Array<{ address: string }>;
  text?: string;
  html?: string;
}

/** Waits until the SMTP fake holds a mail to `to` whose text matches `pattern`; returns the first match group or the whole match. */
export async function waitForMailLink(to: string, pattern: RegExp, timeoutMs = 30_000): Promise<string> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const res = await fetch(`${mailApiUrl()}/api/email`);
    const mails = (await res.json()) as MaildevMessage[];
    for (const m of mails.filter((x) => x.to.some((t) => t.address.toLowerCase() === to.toLowerCase()))) {
      const found = pattern.exec(`${m.text ?? ''}\n${m.html ?? ''}`);
      if (found) return found[1] ?? found[0];
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error(`No mail to ${to} matching ${pattern} arrived within ${timeoutMs} ms`);
}
