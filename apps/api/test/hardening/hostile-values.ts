import fc from 'fast-check';

/** SQL that would change data or leak rows if any text field reached SQL unparameterised. */
export const SQL_INJECTIONS = [
  "'; DROP TABLE users; --",
  "' OR '1'='1",
  "x' UNION SELECT password_hash FROM users --",
  '1; DELETE FROM notebooks',
  "'); UPDATE users SET site_role = 'admin'; --",
  "\\'; SELECT pg_sleep(5); --",
  '$1',
  "E'\\x00'",
];

/** Markup that would run script if a renderer passed it through. */
export const SCRIPT_INJECTIONS = [
  '<script>alert(1)</script>',
  '<img src=x onerror=alert(1)>',
  '[x](javascript:alert(1))',
  '<svg onload=alert(1)>',
  '<iframe srcdoc="<script>alert(1)</script>"></iframe>',
  '"><a href="javascript:alert(1)">x</a>',
];

/** Text PostgreSQL or JSON handling may choke on. */
export const AWKWARD_TEXT = [
  '', ' ', '\u0000', 'a\u0000b', '\ud800', '\udfff x', '\u202e', '\ufeff', '％', '../../etc/passwd', '%00', '%2e%2e%2f',
  '1e309', '-0', 'NaN', 'Infinity', '0x10', '1'.repeat(400), 'é'.repeat(5000), '😀'.repeat(300), 'null', 'undefined',
  '__proto__', 'constructor', '{"$gt": ""}', '00000000-0000-4000-8000-000000000000', 'ZZZZZZZZ-0000-4000-8000-000000000000',
];

export const hostileString: fc.Arbitrary<string> = fc.oneof(
  fc.constantFrom(...SQL_INJECTIONS, ...SCRIPT_INJECTIONS, ...AWKWARD_TEXT),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 20 }),
  fc.string({ unit: 'binary', maxLength: 20 }),
  fc.constantFrom(4_001, 20_001, 100_001).map((n) => 'x'.repeat(n)),
);

const scalar = fc.oneof(
  hostileString,
  fc.integer(),
  fc.constantFrom(0, -1, 1.5, 2 ** 53 + 2, -(2 ** 63), 1e308, -1e308, Number.MIN_VALUE),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.boolean(),
  fc.constant(null),
);

/** Any JSON value, with a bias towards nasty strings and numbers. */
export const hostileJson: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 4, arbitrary: scalar },
  { weight: 1, arbitrary: fc.array(scalar, { maxLength: 5 }) },
  { weight: 1, arbitrary: fc.dictionary(fc.constantFrom('a', '__proto__', 'constructor', 'kind', '$where'), scalar, { maxKeys: 3 }) },
  { weight: 1, arbitrary: fc.nat({ max: 300 }).map((n) => JSON.parse(`${'['.repeat(n)}1${']'.repeat(n)}`)) },
  { weight: 1, arbitrary: fc.nat({ max: 5_000 }).map((n) => Array.from({ length: n }, (_, i) => i)) },
);
