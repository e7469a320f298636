import { defineConfig } from 'vitest/config'
import { fileURLToPath } from 'node:url'

const root = fileURLToPath(new URL('..', import.meta.url))
const alias = { '#shared': fileURLToPath(new URL('../shared', import.meta.url)) }

// Three projects: pure unit tests; API tests over HTTP against the built server and its MariaDB;
// browser tests in Debian's Chromium. `npm test` prepares the server and database first.
export default defineConfig({
  root,
  resolve: { alias },
  test: {
    projects: [
      { resolve: { alias }, test: { name: 'unit', root, include: ['tests/unit/**/*.test.ts'], environment: 'node' } },
      { resolve: { alias }, test: { name: 'api', root, include: ['tests/api/**/*.test.ts'], testTimeout: 30_000, hookTimeout: 60_000 } },
      { resolve: { alias }, test: { name: 'e2e', root, include: ['tests/e2e/**/*.test.ts'], testTimeout: 90_000, hookTimeout: 90_000, fileParallelism: false } },
    ],
  },
})
