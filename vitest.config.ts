import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';
import { fileURLToPath } from 'node:url';

const conditions = ['@basinwright/source', 'module', 'node', 'development|production'];

export default defineConfig({
  test: {
    projects: [
      {
        test: { name: 'common', include: ['tests/common/**/*.test.ts'], environment: 'node' },
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
          testTimeout: 120000,
          hookTimeout: 120000,
        },
      },
    ],
  },
});
