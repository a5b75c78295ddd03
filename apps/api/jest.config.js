// Jest for the API: unit specs beside the code (src/**/*.spec.ts) and HTTP tests (test/*.e2e-spec.ts)
// against the real PostgreSQL that `npm test` starts (DATABASE_URL etc. come from the launcher).
const swc = {
  jsc: {
    parser: { syntax: 'typescript', decorators: true },
    transform: { legacyDecorator: true, decoratorMetadata: true },
    target: 'es2022',
    keepClassNames: true,
  },
  module: { type: 'commonjs' },
  sourceMaps: 'inline',
};

/** @type {import('jest').Config} */
module.exports = {
  rootDir: __dirname,
  testEnvironment: 'node',
  testMatch: ['<rootDir>/src/**/*.spec.ts', '<rootDir>/test/**/*.e2e-spec.ts'],
  moduleFileExtensions: ['ts', 'js', 'mjs', 'json'],
  transform: {
    '^.+\\.ts$': ['@swc/jest', swc],
    // chevrotain (used by @cribra/lang) ships only ES modules; Jest on Node 20 needs CommonJS.
    '^.+\\.m?js$': ['@swc/jest', { ...swc, jsc: { ...swc.jsc, parser: { syntax: 'ecmascript' } } }],
  },
  transformIgnorePatterns: ['/node_modules/(?!chevrotain/|marked/)', '/dist/'],
  // Our libraries are read from source, like vitest does.
  moduleNameMapper: {
    '^@cribra/engine/node$': '<rootDir>/../../libs/engine/src/node/index.ts',
    '^@cribra/(engine|lang|contracts|pg-listen)$': '<rootDir>/../../libs/$1/src/index.ts',
    // chevrotain is ESM only (its helper packages export an "import" entry only, which Jest cannot
    // resolve); its single-file bundle is compiled to CommonJS by the transform below instead.
    '^chevrotain$': '<rootDir>/../../node_modules/chevrotain/lib/chevrotain.mjs',
    // marked (the note Markdown of the LaTeX export) is ES modules only as well.
    '^marked$': '<rootDir>/../../node_modules/marked/lib/marked.esm.js',
    // chevrotain's helper packages export only an "import" condition, which Jest's resolver skips.
    '^@chevrotain/([a-z-]+)$': '<rootDir>/../../node_modules/@chevrotain/$1/lib/src/api.js',
  },
  testTimeout: 30_000,
  maxWorkers: 1,
};
