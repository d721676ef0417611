// Building and serving the Next app: `next build` when sources changed, `next start` as a direct child so its pid
// is the server itself (killing `npx next start` leaves its next-server child running, so we start and stop the server process itself).
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { buildBundles } from '../build-bundles.mjs';
import { sleep, waitFor, waitForPidExit } from './process';

const NEXT_BIN = join('node_modules', 'next', 'dist', 'bin', 'next');
// Anything that changes the build output. Folders are walked recursively.
const BUILD_INPUTS = [
  'app',
  'components',
  'lib',
  'types',
  'public',
  'next.config.ts',
  'instrumentation.ts',
  'tailwind.config.ts',
  'postcss.config.mjs',
  'package.json',
  'tsconfig.json',
];

function newestMtime(path: string): number {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs; // a deleted file shows up as a newer folder
  for (const entry of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, entry)));
  return newest;
}

/** Why a build is needed (no build yet, or a source newer than .next/BUILD_ID), or null when the build is current. */
export function buildNeededBecause(root: string): string | null {
  const buildId = join(root, '.next', 'BUILD_ID');
  if (!existsSync(buildId)) return 'no .next/BUILD_ID yet';
  const builtAt = statSync(buildId).mtimeMs;
  const changed = BUILD_INPUTS.find((input) => newestMtime(join(root, input)) > builtAt);
  return changed ? `${changed} changed since the last build` : null;
}

export function nextEnv(extra: Record<string, string>): NodeJS.ProcessEnv {
  return { ...process.env, NEXT_TELEMETRY_DISABLED: '1', ...extra };
}

/** `next build` with inherited output; `track` receives the child so a caller can stop it on Ctrl-C. */
export async function runNextBuild(root: string, env: NodeJS.ProcessEnv, track?: (child: ChildProcess) => void): Promise<number> {
  await buildBundles(); // the job pool's thread bundle, which `next start` loads at run time
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [NEXT_BIN, 'build'], {
      cwd: root,
      env: { ...env, NODE_ENV: 'production' },
      stdio: ['ignore', 'inherit', 'inherit'],
    });
    track?.(child);
    child.on('error', () => resolve(1));
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

export interface NextServer {
  url: string;
  child: ChildProcess;
  /** Resolves when the server exits on its own or is stopped, with its exit code. */
  exited: Promise<number>;
  stop(): Promise<void>;
}

export async function startNextServer(
  root: string,
  {
    port,
    env,
    timeoutMs = 60_000,
    track,
  }: { port: number; env: NodeJS.ProcessEnv; timeoutMs?: number; track?: (child: ChildProcess) => void },
): Promise<NextServer> {
  const url = `http://127.0.0.1:${port}`;
  await buildBundles(); // when .build/ was removed or is older than its sources while .next is current
  // BENCH_NODE_FLAGS: extra node flags for the server (a profile of a benchmark: "--cpu-prof --cpu-prof-dir=/tmp/p")
  const flags = (process.env.BENCH_NODE_FLAGS ?? '').split(' ').filter(Boolean);
  const child = spawn(process.execPath, [...flags, NEXT_BIN, 'start', '-H', '127.0.0.1', '-p', String(port)], {
    cwd: root,
    env: { ...env, NODE_ENV: 'production' },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  track?.(child);
  let exitNote: string | null = null;
  const exited = new Promise<number>((resolve) => {
    child.on('exit', (code, signal) => {
      exitNote = `next start exited (code ${code}, signal ${signal})`;
      resolve(code ?? (signal ? 128 : 1));
    });
    child.on('error', (error) => {
      exitNote = `could not run next start: ${error.message}`;
      resolve(1);
    });
  });
  const stop = async () => {
    if (exitNote || child.pid === undefined) return;
    child.kill('SIGTERM');
    if (!(await waitForPidExit(child.pid, 10_000))) child.kill('SIGKILL');
    await Promise.race([exited, sleep(2_000)]);
  };
  const ready = await waitFor(
    async () => {
      try {
        await fetch(url, { redirect: 'manual', signal: AbortSignal.timeout(5_000) });
        return true; // any HTTP answer means it is serving
      } catch {
        return false;
      }
    },
    { timeoutMs, intervalMs: 300, abort: () => exitNote },
  );
  if (!ready.ok) {
    await stop();
    throw new Error(`Next server on ${url} did not come up: ${ready.reason}`);
  }
  return { url, child, exited, stop };
}
