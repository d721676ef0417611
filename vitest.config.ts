import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Four projects: `signal` is pure computation (no database); `charts` the D3 chart helpers and components;
// `architecture` the import rules of .dependency-cruiser.cjs;
// `integration` gets a throwaway MariaDB from tests/setup/global-db.ts (started once per run, its own data dir and
// port, stopped at the end). Timeouts are generous safety limits for a loaded 2-core machine, not speed checks.
export default defineConfig({
  resolve: {
    tsconfigPaths: true,
    // 'server-only' throws unless resolved under Next's react-server condition; in tests it is a no-op marker.
    alias: { 'server-only': fileURLToPath(new URL('./node_modules/server-only/empty.js', import.meta.url)) },
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'signal',
          include: ['tests/signal/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'charts',
          include: ['tests/charts/**/*.test.ts', 'tests/charts/**/*.test.tsx'],
          environment: 'node',
          testTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'architecture',
          include: ['tests/architecture/**/*.test.ts'],
          environment: 'node',
          testTimeout: 180_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'integration',
          include: ['tests/db/**/*.test.ts', 'tests/api/**/*.test.ts', 'tests/lib/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/setup/global-db.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
