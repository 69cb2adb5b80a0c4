import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';
import { fileURLToPath } from 'node:url';

const conditions = ['@basinwright/source', 'module', 'node', 'development|production'];

export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'common',
          include: ['tests/common/**/*.test.ts'],
          environment: 'node',
          // Property tests run hundreds of studies: a busy 2-core CI machine needs more than 5 s.
          testTimeout: 60000,
        },
        ssr: { resolve: { conditions, externalConditions: ['@basinwright/source'] } },
        resolve: { conditions },
      },
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/api-global-setup.ts'],
          fileParallelism: false,
          testTimeout: 30000,
          hookTimeout: 60000,
        },
        ssr: { resolve: { conditions, externalConditions: ['@basinwright/source'] } },
        resolve: { conditions },
      },
      {
        plugins: [vue()],
        test: {
          name: 'web',
          include: ['tests/web/**/*.test.ts'],
          environment: 'jsdom',
          setupFiles: ['tests/support/web-setup.ts'],
          // CI is a busy 2-core machine: a component's first mount (antd styles, jsdom layout)
          // has taken over vitest's 5 s default there. Tests wait for conditions, never time.
          testTimeout: 30000,
          hookTimeout: 30000,
        },
        resolve: {
          conditions: ['@basinwright/source', 'module', 'browser', 'development|production'],
          alias: { '@': fileURLToPath(new URL('./web/src', import.meta.url)) },
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          fileParallelism: false,
          // A whole browser walk per test, on the same busy machine; Playwright's own
          // per-action wait is set in tests/support/e2e.ts.
          testTimeout: 120000,
          hookTimeout: 120000,
        },
      },
    ],
  },
});
