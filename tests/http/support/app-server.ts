// An app server a test owns: `next start` of the built app (.next) as a process-group leader, so a test can
// SIGKILL the whole group at once (a crash, nothing runs its clean-up) and check that nothing of it survives.
// scripts/lib/next-server.ts starts the harness's server as a plain child; this one is detached on purpose.
import { spawn } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { sleep, waitFor } from '@/scripts/lib/process';

const NEXT_BIN = join('node_modules', 'next', 'dist', 'bin', 'next');
const OUTPUT_LINES = 200;

// A detached group does not die with the test process. If the test process exits without its afterAll (a crash, an
// uncaught error), the 'exit' hook still SIGKILLs every group that is not known to be gone.
const liveGroups = new Set<number>();
let exitHookInstalled = false;
function killLiveGroupsOnExit(): void {
  if (exitHookInstalled) return;
  exitHookInstalled = true;
  process.once('exit', () => {
    for (const pgid of liveGroups) {
      try {
        process.kill(-pgid, 'SIGKILL');
      } catch {
        // already gone
      }
    }
  });
}

export interface AppServer {
  url: string;
  /** pid of `next start`, also the id of its process group */
  pid: number;
  /** the last lines the server printed (stdout and stderr), for failure messages */
  output(): string;
  /** true once the group leader has exited */
  hasExited(): boolean;
  /** signal to the whole process group; resolves once the leader has exited and no group member is left */
  killGroup(signal: NodeJS.Signals): Promise<void>;
  /** SIGTERM to the group, SIGKILL after 10 s; safe to call when it is already gone */
  stop(): Promise<void>;
}

/** Pids of the live processes in a process group (Linux /proc/PID/stat, field 5 is the group id). */
export function processGroupMembers(pgid: number): number[] {
  const members: number[] = [];
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    let stat: string;
    try {
      stat = readFileSync(`/proc/${entry}/stat`, 'utf8');
    } catch {
      continue; // exited while we looked
    }
    // "pid (comm) state ppid pgrp ..."; comm may hold spaces and parentheses, so split after the last ')'
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const state = fields[0];
    if (Number(fields[2]) === pgid && state !== 'Z') members.push(Number(entry));
  }
  return members;
}

export async function startAppServer({
  root = process.cwd(),
  port,
  env,
  timeoutMs = 90_000,
}: {
  root?: string;
  port: number;
  env: NodeJS.ProcessEnv;
  timeoutMs?: number;
}): Promise<AppServer> {
  const url = `http://127.0.0.1:${port}`;
  const child = spawn(process.execPath, [NEXT_BIN, 'start', '-H', '127.0.0.1', '-p', String(port)], {
    cwd: root,
    env: { ...env, NEXT_TELEMETRY_DISABLED: '1', NODE_ENV: 'production' },
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true, // its own process group (setsid), so -pid reaches the server and anything it forks
  });
  if (child.pid === undefined) throw new Error('could not start next start (no pid)');
  const pid = child.pid;
  killLiveGroupsOnExit();
  liveGroups.add(pid);
  const lines: string[] = [];
  const keep = (chunk: Buffer) => {
    lines.push(...chunk.toString().split('\n').filter(Boolean));
    if (lines.length > OUTPUT_LINES) lines.splice(0, lines.length - OUTPUT_LINES);
  };
  child.stdout?.on('data', keep);
  child.stderr?.on('data', keep);
  let exitNote: string | null = null;
  child.on('exit', (code, signal) => (exitNote = `next start (pid ${pid}) exited (code ${code}, signal ${signal})`));
  child.on('error', (error) => (exitNote = `could not run next start: ${error.message}`));
  const output = () => lines.join('\n');

  const killGroup = async (signal: NodeJS.Signals, waitMs = 15_000) => {
    try {
      process.kill(-pid, signal);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== 'ESRCH') throw error; // ESRCH: the group is already gone
    }
    const end = Date.now() + waitMs;
    while ((exitNote === null || processGroupMembers(pid).length > 0) && Date.now() < end) await sleep(50);
    if (exitNote !== null && processGroupMembers(pid).length === 0) liveGroups.delete(pid);
  };
  const stop = async () => {
    if (exitNote !== null && processGroupMembers(pid).length === 0) {
      liveGroups.delete(pid); // a gone group's id may be reused by someone else's process
      return;
    }
    await killGroup('SIGTERM', 10_000);
    if (exitNote === null || processGroupMembers(pid).length > 0) await killGroup('SIGKILL');
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
    { timeoutMs, intervalMs: 250, abort: () => exitNote },
  );
  if (!ready.ok) {
    await stop();
    throw new Error(`app server on ${url} did not come up: ${ready.reason}\n${output()}`);
  }
  return { url, pid, output, hasExited: () => exitNote !== null, killGroup: (signal) => killGroup(signal), stop };
}
