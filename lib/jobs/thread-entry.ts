// Entry of a job worker thread: bundled by scripts/build-bundles.mjs into .build/job-thread.mjs, which the pool in
// lib/jobs/pool.ts loads. piscina calls the default export with each task message.
import { runRegisteredTask, type TaskMessage } from './tasks';

export default function runInThread(message: TaskMessage): Promise<unknown> {
  return runRegisteredTask(message);
}
