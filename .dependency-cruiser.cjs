/**
 * The layer rules of DEVELOPERS.md, checked by `npm run lint:deps` (part of `npm test`):
 * imports point down only — app → server → (db, reports) → lib; lib is pure and imports no layer
 * above it; db holds schema, client and queries and knows nothing of the engine or the reports.
 */
/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: 'db-is-storage-only',
      comment: 'db/ is schema, client and named queries: no engine, checks, reports or services.',
      severity: 'error',
      from: { path: '^db/' },
      to: { path: '^(lib/(calc|checks|linkage|mechanisms|contract)|reports|server|app)/' },
    },
    {
      name: 'lib-is-pure',
      comment: 'lib/ runs in tests, the CLI, the browser and the server alike: nothing from the layers above it.',
      severity: 'error',
      from: { path: '^lib/' },
      to: { path: '^(db|server|app|reports|scripts|tests)/' },
    },
    {
      name: 'engine-below-calc',
      comment: 'The linkage core and the checks sit below the calc and the mechanism registry.',
      severity: 'error',
      from: { path: '^lib/(linkage|checks|units|contract)/' },
      to: { path: '^lib/(calc|mechanisms)/' },
    },
    {
      name: 'reports-below-services',
      severity: 'error',
      from: { path: '^reports/' },
      to: { path: '^(db|server|app)/' },
    },
    {
      name: 'services-below-app',
      severity: 'error',
      from: { path: '^server/' },
      to: { path: '^app/' },
    },
    {
      name: 'nothing-imports-tests',
      severity: 'error',
      from: { path: '^(app|server|db|lib|reports|scripts)/' },
      to: { path: '^tests/' },
    },
    {
      name: 'no-circular',
      severity: 'error',
      from: {},
      to: { circular: true },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    exclude: { path: '(^|/)(node_modules|\\.next|\\.reports|reports-mutation|out|data)/' },
    tsConfig: { fileName: 'tsconfig.json' },
    tsPreCompilationDeps: true,
    enhancedResolveOptions: { exportsFields: ['exports'], conditionNames: ['import', 'require', 'node', 'default'], extensions: ['.ts', '.tsx', '.js', '.mjs', '.cjs'] },
  },
}
