import { describe, expect, it } from 'vitest';
import { emailProblem, newPasswordProblem, safeNextPath } from './validation';

describe('safeNextPath', () => {
  it.each([
    ['/notebooks/42?tab=review', '/notebooks/42?tab=review'],
    ['/data', '/data'],
  ])('keeps the in-app path %s', (input, out) => expect(safeNextPath(input)).toBe(out));

  it.each([null, '', 'https://elsewhere.example/', '//elsewhere.example/x', '/\\elsewhere.example', 'javascript:alert(1)'])(
    'refuses %s and falls back',
    (input) => expect(safeNextPath(input)).toBe('/notebooks'),
  );
});

describe('form checks', () => {
  it('asks for an e-mail and rejects a malformed one', () => {
    expect(emailProblem('')).toBe('Enter your e-mail address.');
    expect(emailProblem('ada@')).toMatch(/does not look like/);
    expect(emailProblem(' ada@example.org ')).toBeUndefined();
  });
  it('asks for 8 characters in a new password', () => {
    expect(newPasswordProblem('1234567')).toMatch(/at least 8/);
    expect(newPasswordProblem('12345678')).toBeUndefined();
  });
});
