import { defineConfig } from 'vitest/config';

// HTTP and browser tests against a running `next start` (E2E_BASE_URL) and its seeded throwaway database
// (DATABASE_URL). scripts/test.ts starts both and passes CHROMIUM_PATH; the files run one at a time because they
// share the server, its sign-in throttle and its data.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ['tests/http/**/*.test.ts', 'tests/e2e/**/*.test.ts'],
    environment: 'node',
    fileParallelism: false,
    testTimeout: 120_000,
    hookTimeout: 120_000,
  },
});
