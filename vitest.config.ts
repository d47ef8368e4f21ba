import { defineConfig } from 'vitest/config'

/**
 * Three projects so each kind of test can run alone (`npm run test:unit` …).
 * Files run two at a time (vitest would use one worker on a two-core machine; API and browser
 * files wait on a database, a server or a browser as much as they compute). Browser tests
 * run after the others: each drives a real Chromium against a real server.
 * Browser tests are vitest files too: playwright-core has no runner of its own.
 */
export default defineConfig({
  test: {
    projects: [
      // A generous timeout: thumbnail tests do real image work, and CI machines can be slow.
      { test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], testTimeout: 30_000, maxWorkers: 2, sequence: { groupOrder: 0 } } },
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          setupFiles: ['tests/helpers/setup-env.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
          maxWorkers: 2,
          sequence: { groupOrder: 0 },
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          setupFiles: ['tests/helpers/setup-env.ts'],
          testTimeout: 90_000,
          hookTimeout: 120_000,
          // A screen may take seconds to show a change on a busy machine (vitest's default: 1 s).
          expect: { poll: { timeout: 15_000, interval: 100 } },
          // After the rest, two files at a time: each spends most of its time waiting on a
          // browser or a server of its own (own port, own database), so two share two cores.
          maxWorkers: 2,
          sequence: { groupOrder: 1 },
        },
      },
    ],
  },
})
