import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import { apiTestEnv } from './tests/api/test-env.ts';

export default defineConfig({
  test: {
    projects: [
      {
        resolve: { alias: { '@': fileURLToPath(new URL('./apps/web/src', import.meta.url)) } },
        test: {
          name: 'unit',
          include: ['packages/*/src/**/*.test.ts', 'apps/api/src/**/*.test.ts', 'apps/web/src/**/*.test.{ts,tsx}', 'apps/web/plugins/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/api/global-setup.ts'],
          setupFiles: ['tests/api/setup-env.ts'],
          env: { ...apiTestEnv },
          fileParallelism: false,
          testTimeout: 20000,
          hookTimeout: 60000,
        },
      },
    ],
  },
});
