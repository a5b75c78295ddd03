// Reads the SMTP fake's inbox through its HTTP API (MAIL_API_URL, set by the launcher).

interface Mail {
  id: string;
  subject: string;
  text?: string;
  to: { address: string }[];
  date: string;
}

const base = () => {
  const url = process.env.MAIL_API_URL;
  if (!url) throw new Error('MAIL_API_URL is not set: run the API tests through `npm test -- --only=api`.');
  return url.replace(/\/+$/, '');
};

export async function mailsTo(address: string): Promise<Mail[]> {
  const res = await fetch(`${base()}/api/email`);
  if (!res.ok) throw new Error(`SMTP fake answered ${res.status}`);
  const all = (await res.json()) as Mail[];
  return all
    .filter((m) => m.to.some((t) => t.address.toLowerCase() === address.toLowerCase()))
    .sort((a, b) => new Date(a.date).getTime() - new Date(b.date).getTime());
}

/** Waits (briefly) for the n-th mail to `address` and returns it. */
export async function waitForMail(address: string, count = 1, timeoutMs = 10_000): Promise<Mail> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const mails = await mailsTo(address);
    if (mails.length >= count) return mails[count - 1];
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`no mail number ${count} to ${address} within ${timeoutMs} ms`);
}
