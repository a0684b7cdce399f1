import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';
import vue from '@vitejs/plugin-vue';
import Components from 'unplugin-vue-components/vite';
import { ElementPlusResolver } from 'unplugin-vue-components/resolvers';

const alias = {
  '@': fileURLToPath(new URL('./web/src', import.meta.url)),
  '@shared': fileURLToPath(new URL('./shared/src', import.meta.url)),
};

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        // Pure units: shared schemas and checks, policies, web components and composables.
        plugins: [vue(), Components({ resolvers: [ElementPlusResolver()], dts: false })],
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['shared/src/**/*.spec.ts', 'api/src/**/*.spec.ts', 'web/src/**/*.spec.ts', 'tests/reference/**/*.test.ts'],
          environment: 'node',
          server: { deps: { inline: ['element-plus'] } },
        },
      },
      {
        // The real server on port 0 against the real PostgreSQL (DATABASE_URL from the bootstrap).
        resolve: { alias },
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts', 'tests/realtime/**/*.test.ts', 'tests/search/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/global-setup.ts'],
          testTimeout: 20_000,
          hookTimeout: 30_000,
          fileParallelism: true,
          maxWorkers: 2,
        },
      },
      {
        // Real Chromium against the built app served by the built API.
        resolve: { alias },
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.e2e.ts'],
          environment: 'node',
          globalSetup: ['tests/e2e/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
