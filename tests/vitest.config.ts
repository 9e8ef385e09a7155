import { defineConfig } from 'vitest/config'
import vue from '@vitejs/plugin-vue'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('..', import.meta.url))

// One config, four projects: pure maths, API against a real PostgreSQL, Vue components, browser.
export default defineConfig({
  test: {
    root,
    projects: [
      {
        test: {
          name: 'orient',
          root,
          include: ['tests/orient/**/*.test.ts'],
          environment: 'node',
        },
      },
      {
        test: {
          name: 'backend',
          root,
          include: ['tests/backend/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/backend/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        plugins: [vue()],
        test: {
          name: 'frontend',
          root,
          include: ['tests/frontend/**/*.test.ts'],
          environment: 'happy-dom',
        },
      },
      {
        test: {
          name: 'e2e',
          root,
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/e2e/global-setup.ts'],
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
})
