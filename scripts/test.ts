// npm test: a throwaway MariaDB (fresh .data/test-* dir, free port) -> migrate -> vitest (signal + integration)
// -> next build -> demo seed -> next start on a free port -> vitest e2e/http -> stop everything, remove the dir.
// Ends with the line "N passed, N failed" (summed over the vitest runs) and a non-zero exit on any failure.
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { migrateLatest, seedDemoAt } from './lib/database';
import { findFreePort } from './lib/free-port';
import { startLocalFakes, type LocalFakes } from './lib/local-fakes';
import { nextEnv, runNextBuild, startNextServer, type NextServer } from './lib/next-server';
import { startThrowawayMariadb, type ThrowawayMariadb } from './lib/throwaway-mariadb';
import { ensureTestPackages } from './lib/system-packages';

const root = process.cwd();
const E2E_CONFIG = 'vitest.e2e.config.ts';
const VITEST_BIN = join('node_modules', 'vitest', 'vitest.mjs');
const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
// `npm test -- tests/http/sessions tests/lib/jobs` runs only the test files whose paths contain one of the filters
// (vitest's own file filter), in both vitest runs, with the same database, build and server. No filter: everything.
const FILTERS = process.argv.slice(2).filter((arg) => !arg.startsWith('-'));
const FILTER_ARGS = FILTERS.length > 0 ? [...FILTERS, '--passWithNoTests'] : [];

interface Counts {
  passed: number;
  failed: number;
}
const totals: Counts = { passed: 0, failed: 0 };
const problems: string[] = [];
const children = new Set<ChildProcess>();
let database: ThrowawayMariadb | undefined;
let server: NextServer | undefined;
let fakes: LocalFakes | undefined;
let interrupted = false;

function banner(text: string) {
  console.log(`\n=== ${text} ${'='.repeat(Math.max(3, 76 - text.length))}`);
}

/** Runs one vitest invocation with a JSON report and adds its counts to the totals. */
function track(child: ChildProcess): void {
  children.add(child);
  child.on('exit', () => children.delete(child));
}

/** Stops the run between steps once Ctrl-C arrived (the signal handler does the cleaning up). */
function checkInterrupted(): void {
  if (interrupted) throw new Error('interrupted');
}

async function runVitest(label: string, args: string[], env: NodeJS.ProcessEnv, reportDir: string): Promise<void> {
  checkInterrupted();
  const report = join(reportDir, `vitest-${label}.json`);
  const code = await new Promise<number>((resolve) => {
    const child = spawn(
      process.execPath,
      [VITEST_BIN, 'run', ...args, ...FILTER_ARGS, '--reporter=default', '--reporter=json', `--outputFile.json=${report}`],
      { cwd: root, env, stdio: ['ignore', 'inherit', 'inherit'] },
    );
    track(child);
    child.on('error', () => resolve(1));
    child.on('exit', (exitCode, signal) => resolve(exitCode ?? (signal ? 128 : 1)));
  });
  checkInterrupted();
  if (existsSync(report)) {
    const parsed = JSON.parse(readFileSync(report, 'utf8')) as { numPassedTests?: number; numFailedTests?: number };
    totals.passed += parsed.numPassedTests ?? 0;
    totals.failed += parsed.numFailedTests ?? 0;
  }
  if (code !== 0) problems.push(`vitest ${label} exited with code ${code}${existsSync(report) ? '' : ' (no report written)'}`);
}

async function cleanUp(): Promise<void> {
  for (const child of children) child.kill('SIGTERM');
  await server?.stop().catch((error: unknown) => console.error('stopping next:', error));
  server = undefined;
  await fakes?.stop().catch((error: unknown) => console.error('stopping fakes:', error));
  fakes = undefined;
  await database?.dispose().catch((error: unknown) => console.error('stopping MariaDB:', error));
  database = undefined;
}

function summarise(): number {
  banner('summary');
  for (const problem of problems) console.log(`FAILED: ${problem}`);
  console.log(`${totals.passed} passed, ${totals.failed} failed`);
  return problems.length === 0 && totals.failed === 0 ? 0 : 1;
}

async function main(): Promise<void> {
  await ensureTestPackages();
  banner('throwaway MariaDB');
  database = await startThrowawayMariadb(root);
  const { databaseUrl } = database;
  const reportDir = database.config.dir;
  console.log(`127.0.0.1:${database.config.port}, ${database.config.dir}`);
  await migrateLatest(databaseUrl);

  // A secret for this run only; the e2e server signs sessions with it.
  const secret = randomBytes(32).toString('hex');
  const baseEnv = nextEnv({ DATABASE_URL: databaseUrl, NEXTAUTH_SECRET: secret, RESEARCH_CODE_SECRET: randomBytes(32).toString('hex'), CHROMIUM_PATH });

  banner('vitest: signal + integration');
  await runVitest('unit', [], { ...baseEnv, NODE_ENV: 'test' }, reportDir);

  banner('next build');
  const port = await findFreePort();
  const url = `http://127.0.0.1:${port}`;
  fakes = await startLocalFakes(join(reportDir, 'fakes'));
  // Raw files of a local-folder run (LOCAL_S3_FAKE=off) go to the run's own dir too.
  const appEnv = { STORAGE_DIR: join(reportDir, 'uploads'), ...baseEnv, ...fakes.env, NEXTAUTH_URL: url, PORT: String(port) };
  checkInterrupted();
  const buildCode = await runNextBuild(root, appEnv, track);
  checkInterrupted();
  if (buildCode !== 0) {
    problems.push(`next build exited with code ${buildCode}`);
    return;
  }

  if (!existsSync(join(root, E2E_CONFIG))) {
    problems.push(`${E2E_CONFIG} is missing: the browser/HTTP tests cannot run`);
    return;
  }

  banner('browser/HTTP tests');
  await seedDemoAt(databaseUrl);
  checkInterrupted();
  server = await startNextServer(root, { port, env: appEnv, track });
  console.log(`next start on ${server.url}`);
  await runVitest('e2e', ['--config', E2E_CONFIG], { ...appEnv, E2E_BASE_URL: server.url, NODE_ENV: 'test' }, reportDir);
}

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (interrupted) return;
    interrupted = true;
    console.error(`\n${signal}: stopping everything this run started ...`);
    problems.push(`interrupted by ${signal}`);
    void cleanUp().then(() => {
      summarise();
      process.exit(130);
    });
  });
}

main()
  .catch((error: unknown) => {
    problems.push(error instanceof Error ? error.message : String(error));
  })
  .finally(async () => {
    if (interrupted) return;
    await cleanUp();
    process.exit(summarise());
  });
