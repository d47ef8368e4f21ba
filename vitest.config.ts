import { defineConfig } from 'vitest/config'

/**
 * Three projects so each kind of test can run alone (`npm run test:unit` …).
 * Browser tests are vitest files too: playwright-core has no runner of its own.
 */
export default defineConfig({
  test: {
    projects: [
      { test: { name: 'unit', include: ['tests/unit/**/*.test.ts'] } },
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          setupFiles: ['tests/helpers/setup-env.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          setupFiles: ['tests/helpers/setup-env.ts'],
          testTimeout: 90_000,
          hookTimeout: 120_000,
          // One browser at a time: the machine has two cores.
          fileParallelism: false,
        },
      },
    ],
  },
})
