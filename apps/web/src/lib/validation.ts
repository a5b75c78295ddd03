import { MIN_PASSWORD_LENGTH } from '@cribra/contracts';

// Client-side checks mirror the API's validation only to give early feedback; the API stays the judge.

const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

export function emailProblem(value: string): string | undefined {
  if (!value.trim()) return 'Enter your e-mail address.';
  if (!EMAIL.test(value.trim())) return 'This does not look like an e-mail address.';
  return undefined;
}

export function requiredProblem(value: string, what: string): string | undefined {
  return value.trim() ? undefined : `Enter ${what}.`;
}

export function newPasswordProblem(value: string): string | undefined {
  if (!value) return 'Choose a password.';
  if (value.length < MIN_PASSWORD_LENGTH) return `Use at least ${MIN_PASSWORD_LENGTH} characters.`;
  return undefined;
}

/** A redirect target taken from the URL must stay inside the app (no other host, no protocol). */
export function safeNextPath(next: string | null | undefined, fallback = '/notebooks'): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  return next;
}
