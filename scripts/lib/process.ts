import { spawn, type SpawnOptions } from 'node:child_process';

export interface RunResult {
  code: number | null;
  signal: NodeJS.Signals | null;
  stdout: string;
  stderr: string;
}

/** Runs a command to completion, capturing its output; never throws on a non-zero exit. */
export function runCapture(
  command: string,
  args: readonly string[],
  options: SpawnOptions & { input?: string } = {},
): Promise<RunResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { ...options, stdio: ['pipe', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout?.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
    child.stderr?.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
    child.on('error', reject);
    child.on('close', (code, signal) => resolve({ code, signal, stdout, stderr }));
    // A child that exits before reading its stdin (mariadb-admin ping against a server still starting) makes this
    // write fail with EPIPE; its exit code already says what happened, so the pipe error is not a failure of ours.
    child.stdin?.on('error', (error: NodeJS.ErrnoException) => {
      if (error.code !== 'EPIPE') reject(error);
    });
    child.stdin?.end(options.input ?? '');
  });
}

/** Runs a command with inherited stdio (output goes straight to the terminal); resolves with its exit code. */
export function runInherit(command: string, args: readonly string[], options: SpawnOptions = {}): Promise<number> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { ...options, stdio: ['ignore', 'inherit', 'inherit'] });
    child.on('error', reject);
    child.on('close', (code, signal) => resolve(code ?? (signal ? 128 : 1)));
  });
}

/** True when a process with this pid exists (signal 0 probes without delivering anything). */
export function isPidAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    // EPERM means it exists but belongs to someone else.
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

export const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

/** Polls until the pid is gone; returns false if it is still alive after timeoutMs. */
export async function waitForPidExit(pid: number, timeoutMs: number): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (!isPidAlive(pid)) return true;
    await sleep(100);
  }
  return !isPidAlive(pid);
}

/** Polls an async probe until it returns true or the deadline passes. `abort` ends the wait early (e.g. the process died). */
export async function waitFor(
  probe: () => Promise<boolean>,
  { timeoutMs, intervalMs = 200, abort }: { timeoutMs: number; intervalMs?: number; abort?: () => string | null },
): Promise<{ ok: true } | { ok: false; reason: string }> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const aborted = abort?.();
    if (aborted) return { ok: false, reason: aborted };
    if (await probe()) return { ok: true };
    if (Date.now() >= deadline) return { ok: false, reason: `timed out after ${Math.round(timeoutMs / 1000)} s` };
    await sleep(intervalMs);
  }
}
