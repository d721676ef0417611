// The registry of tasks the job pool (lib/jobs/pool.ts) can run in its worker threads. Each entry is a function of
// a structured-clonable payload (typed arrays, plain objects; no class instances, no functions, no database or store
// handles: a task that needs them opens its own from plain data, as "process-job" does) to a structured-clonable
// result. To add one: write lib/jobs/tasks/<name>.ts, add it
// here, and list the file in scripts/build-bundles.mjs (the `job-thread` bundle's inputs). DEVELOPERS.md "Job pool".
import { processJobTask } from './process-job';
import { analyzeWindowTask } from './analyze-window';

export const TASKS = {
  'process-job': processJobTask,
  'analyze-window': analyzeWindowTask,
} as const;

export type TaskName = keyof typeof TASKS;
export type TaskPayload<N extends TaskName> = Parameters<(typeof TASKS)[N]>[0];
export type TaskResult<N extends TaskName> = Awaited<ReturnType<(typeof TASKS)[N]>>;

export interface TaskMessage {
  name: string;
  payload: unknown;
}

/** Runs a registered task on this thread (the worker thread's entry and the in-process runner both call it). */
export async function runRegisteredTask(message: TaskMessage): Promise<unknown> {
  if (!Object.hasOwn(TASKS, message.name)) throw new Error(`unknown task "${message.name}"`);
  const task = TASKS[message.name as TaskName] as (payload: unknown) => unknown;
  return task(message.payload);
}
