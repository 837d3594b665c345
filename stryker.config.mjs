// @ts-check
/**
 * Mutation testing of the engine, the checks and the unit table (issue 14).
 * `npm run test:mutation` — about 45 min on 2 cores; not part of `npm test`.
 * One file: `npx stryker run --mutate lib/checks/pin.ts`.
 * Report: reports-mutation/mutation.html (and .json), ignored by git.
 * @type {import('@stryker-mutator/api/core').PartialStrykerOptions}
 */
export default {
  testRunner: 'vitest',
  vitest: { configFile: 'vitest.stryker.config.ts', related: false },
  checkers: ['typescript'],
  tsconfigFile: 'tsconfig.stryker.json',
  typescriptChecker: { prioritizePerformanceOverAccuracy: true },
  mutate: [
    'lib/checks/bases/**/*.ts',
    'lib/checks/pin.ts',
    'lib/checks/sections.ts',
    'lib/linkage/statics.ts',
    'lib/linkage/geometry.ts',
    'lib/linkage/cells/**/*.ts',
    'lib/units/**/*.ts',
  ],
  ignorePatterns: ['/.next', '/data', '/out', '/.reports', '/test-results', '/playwright-report', '/tmp', '/reports-mutation'],
  reporters: ['html', 'json', 'clear-text', 'progress'],
  htmlReporter: { fileName: 'reports-mutation/mutation.html' },
  jsonReporter: { fileName: 'reports-mutation/mutation.json' },
  tempDirName: 'reports-mutation/.stryker-tmp',
  cleanTempDir: true,
  concurrency: 2,
  timeoutMS: 20000,
  thresholds: { high: 90, low: 80, break: null },
}
