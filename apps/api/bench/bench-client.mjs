// A signed-in HTTP client for the bench scripts: cookie jar, CSRF header, JSON in and out.
export class BenchClient {
  constructor(base) {
    this.base = base.replace(/\/+$/, '');
    this.jar = new Map();
    this.csrf = undefined;
  }

  cookieHeader() {
    return [...this.jar].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  async call(method, path, body) {
    if (method !== 'GET' && !this.csrf) await this.fetchCsrf();
    const headers = { Cookie: this.cookieHeader() };
    if (method !== 'GET') headers['x-csrf-token'] = this.csrf;
    if (body !== undefined) headers['Content-Type'] = 'application/json';
    const res = await fetch(`${this.base}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    for (const line of res.headers.getSetCookie?.() ?? []) {
      const [pair] = line.split(';');
      const i = pair.indexOf('=');
      this.jar.set(pair.slice(0, i).trim(), pair.slice(i + 1).trim());
    }
    const text = await res.text();
    let json;
    try {
      json = text ? JSON.parse(text) : undefined;
    } catch {
      json = undefined;
    }
    return { status: res.status, body: json, text };
  }

  async fetchCsrf() {
    const r = await fetch(`${this.base}/api/auth/csrf`, { headers: { Cookie: this.cookieHeader() } });
    for (const line of r.headers.getSetCookie?.() ?? []) {
      const [pair] = line.split(';');
      const i = pair.indexOf('=');
      this.jar.set(pair.slice(0, i).trim(), pair.slice(i + 1).trim());
    }
    this.csrf = (await r.json()).token;
  }

  /** Signs up a fresh bench account (open sign-up) and keeps its session. */
  async signUpFresh(tag) {
    const email = `bench.${tag}.${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}@bench.example`;
    const r = await this.call('POST', '/api/auth/signup', { email, password: 'bench-password-7', displayName: `Bench ${tag}` });
    if (r.status !== 201) throw new Error(`sign-up at ${this.base} failed (${r.status}): ${r.text.slice(0, 200)} — the bench needs SIGNUP_MODE=open`);
    return email;
  }
}

/** p-th percentile (nearest rank) of an ascending array. */
export function percentile(sorted, p) {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))];
}

export function summary(latencies) {
  const s = [...latencies].sort((a, b) => a - b);
  return { n: s.length, p50: percentile(s, 50), p95: percentile(s, 95), p99: percentile(s, 99), max: s.at(-1) };
}

export const fmt = (ms) => (Number.isFinite(ms) ? `${ms.toFixed(1)} ms` : '—');

/** The first k primes above k: an admissible k-tuple (no prime p ≤ k can cover all classes), shifted to start at 0. */
export function admissibleTuple(k) {
  const out = [];
  for (let n = k + 1; out.length < k; n++) {
    let prime = n > 1;
    for (let d = 2; d * d <= n; d++) if (n % d === 0) { prime = false; break; }
    if (prime) out.push(n);
  }
  return out.map((p) => p - out[0]);
}
