import { defineConfig } from 'vitest/config'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('./', import.meta.url))
const alias = { '#shared': `${root}shared`, '~': root }

// Three projects: pure unit tests; tests that talk to the built server (HTTP, WebSocket, browser)
// on SQLite; and the HTTP, live and several-node suites again on PostgreSQL with Redis (throwaway
// servers started by the global setup). Each server project shares one built server started by
// tests/support/global-server.ts.
export default defineConfig({
  test: {
    projects: [
      {
        resolve: { alias },
        test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' },
      },
      {
        resolve: { alias },
        test: {
          name: 'server',
          include: ['tests/server/**/*.test.ts', 'tests/live/**/*.test.ts', 'tests/e2e/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/support/global-server.ts'],
          // 2 cores: one file at a time keeps browser and socket timings honest.
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'postgres',
          include: ['tests/server/**/*.test.ts', 'tests/live/**/*.test.ts', 'tests/multinode/**/*.test.ts'],
          environment: 'node',
          // A group of its own: its files never run beside the server project's (2 cores).
          sequence: { groupOrder: 1 },
          globalSetup: ['tests/support/global-server.ts'],
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
    ],
  },
})
