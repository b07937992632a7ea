import { defineConfig } from 'vitest/config';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.dirname(fileURLToPath(import.meta.url));

// `server-only` throws outside React Server Components; tests run server code directly.
const alias = {
  '@': root,
  'server-only': path.join(root, 'node_modules/server-only/empty.js'),
};
const testDatabaseUrl = process.env.TEST_DATABASE_URL ?? 'postgres://app@127.0.0.1:54329/ampwright_test';

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          globalSetup: ['tests/helpers/global-setup.ts'],
          env: { DATABASE_URL: testDatabaseUrl, APP_URL: 'http://127.0.0.1:3100' },
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/helpers/e2e-setup.ts'],
          env: { DATABASE_URL: testDatabaseUrl },
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 240_000,
        },
      },
    ],
  },
});
