/**
 * Vitest config for mutation testing only (`npm run test:mutation`, stryker.config.mjs):
 * the engine, checks and unit tests — no database, build or browser tests.
 */
import { defineConfig } from 'vitest/config'

export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ['tests/linkage/**/*.test.ts', 'tests/checks/**/*.test.ts', 'tests/units/**/*.test.ts'],
    exclude: ['node_modules/**'],
    environment: 'node',
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
})
