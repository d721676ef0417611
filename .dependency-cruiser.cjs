// The architecture rules, checked by dependency-cruiser from tests/architecture/boundaries.test.ts (part of npm test).
// Run by hand: npx depcruise app components lib --config .dependency-cruiser.cjs
const { existsSync, readdirSync, readFileSync } = require('node:fs');
const { join, relative } = require('node:path');

/** Packages the pure signal core may import; anything else (and anything from the app) is a violation. */
const SIGNAL_PACKAGES = ['d3-array', 'fili', 'ml-matrix', 'papaparse', 'zod'];

const escape = (s) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/**
 * Client components: the files that start with the 'use client' directive (Next.js bundles them, and all they
 * import, for the browser). dependency-cruiser has no notion of directives, so the list is read here.
 */
function clientFiles(root) {
  const out = [];
  const walk = (dir) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const path = join(dir, entry.name);
      if (entry.isDirectory()) walk(path);
      else if (/\.(ts|tsx)$/.test(entry.name) && /^\s*(\/\/[^\n]*\n\s*)*['"]use client['"]/.test(readFileSync(path, 'utf8'))) {
        out.push(relative(root, path).split('\\').join('/'));
      }
    }
  };
  for (const dir of ['app', 'components', 'lib']) if (existsSync(join(root, dir))) walk(join(root, dir));
  return out;
}
// Paths are relative to where depcruise runs (the repository root; the test's own fixture tree for the self-check).
const CLIENT_FILES = clientFiles(process.cwd());

/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: 'lib-not-to-app-or-components',
      comment: 'lib/ is below the UI: it never imports components/ or app/ (contracts live in lib/contracts).',
      severity: 'error',
      from: { path: '^lib/' },
      to: { path: '^(components|app)/' },
    },
    {
      name: 'signal-is-self-contained',
      comment: 'lib/signal is pure computation: nothing from the rest of the app (@/), only its own files.',
      severity: 'error',
      from: { path: '^lib/signal/' },
      to: { pathNot: '^lib/signal/', dependencyTypesNot: ['npm', 'npm-dev', 'npm-optional', 'npm-peer', 'npm-no-pkg', 'npm-unknown'] },
    },
    {
      name: 'signal-only-allowed-packages',
      comment: `lib/signal imports only these packages: ${SIGNAL_PACKAGES.join(', ')} (no I/O, no node: builtins).`,
      severity: 'error',
      from: { path: '^lib/signal/' },
      to: { dependencyTypes: ['npm', 'npm-dev', 'npm-optional', 'npm-peer', 'npm-no-pkg', 'npm-unknown', 'core'], pathNot: `^node_modules/(${SIGNAL_PACKAGES.map(escape).join('|')})/` },
    },
    {
      name: 'no-circular',
      comment: 'No import cycles, type-only imports included (tsPreCompilationDeps keeps them in the graph).',
      severity: 'error',
      from: {},
      to: { circular: true },
    },
    {
      name: 'client-not-to-server-only',
      comment:
        "A 'use client' file never reaches a server-only module (one that imports the server-only package), not even " +
        'through a type-only import: shapes a client needs live in lib/contracts.',
      severity: 'error',
      from: { path: CLIENT_FILES.length ? `^(${CLIENT_FILES.map(escape).join('|')})$` : '^$' },
      to: { path: '^node_modules/server-only/', reachable: true },
    },
    {
      name: 'not-to-unresolvable',
      comment: 'Every import resolves (a typo or a deleted module is caught here, not at build time).',
      severity: 'error',
      from: {},
      // knex/types/tables is a type-only module that knex declares for augmentation (types/knex-tables.d.ts); it has
      // no file of its own behind the package's exports map, so only the type checker resolves it.
      to: { couldNotResolve: true, pathNot: '^knex/types/tables$' },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    exclude: { path: ['^\\.next/', '^\\.data/'] },
    // Keep `import type` edges in the graph: the no-circular rule covers type-only cycles too.
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.json' },
    enhancedResolveOptions: {
      exportsFields: ['exports'],
      conditionNames: ['import', 'require', 'node', 'default', 'types'],
      extensions: ['.ts', '.tsx', '.js', '.mjs', '.cjs', '.json'],
      mainFields: ['module', 'main', 'types', 'typings'],
    },
    combinedDependencies: false,
  },
};
