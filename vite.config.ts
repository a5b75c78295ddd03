import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));

// Libraries are consumed from source by the web app and by vitest; Node apps use their built dist.
const alias = {
  '@cribra/engine/node': here('./libs/engine/src/node/index.ts'),
  '@cribra/engine': here('./libs/engine/src/index.ts'),
  '@cribra/lang/node': here('./libs/lang/src/node/index.ts'),
  '@cribra/lang': here('./libs/lang/src/index.ts'),
  '@cribra/contracts': here('./libs/contracts/src/index.ts'),
};

export default defineConfig({
  root: here('./apps/web'),
  publicDir: here('./apps/web/public'),
  plugins: [react()],
  resolve: { alias },
  worker: { format: 'es' },
  build: {
    outDir: here('./apps/web/dist'),
    emptyOutDir: true,
    chunkSizeWarningLimit: 4096,
  },
  server: {
    host: '127.0.0.1',
    proxy: { '/api': 'http://127.0.0.1:4310' },
  },
  test: {
    root: here('.'),
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'libs',
          globalSetup: ['libs/engine/test/global-setup.ts'],
          root: here('.'),
          environment: 'node',
          include: ['libs/*/src/**/*.test.ts', 'libs/*/test/**/*.test.ts', 'apps/cli/src/**/*.test.ts', 'apps/cli/test/**/*.test.ts', 'apps/launcher/test/**/*.test.mjs'],
          testTimeout: 60_000,
        },
      },
      {
        plugins: [react()],
        resolve: { alias },
        test: {
          name: 'web',
          root: here('.'),
          environment: 'jsdom',
          include: ['apps/web/src/**/*.test.{ts,tsx}'],
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          root: here('.'),
          environment: 'node',
          include: ['apps/web/e2e/**/*.e2e.ts'],
          testTimeout: 180_000,
          hookTimeout: 180_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
