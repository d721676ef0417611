// The video worker of this server process: polls the videos table beside the recordings' worker (lib/jobs/start.ts
// starts it), one video at a time (ffmpeg uses the cores itself).
import type { Knex } from 'knex';
import type { RawFileStore } from '@/lib/storage/types';
import { runOneVideo } from './jobs';

const globalForVideo = globalThis as typeof globalThis & { __stancelineVideoWake?: () => void };

export function startVideoWorker(db: Knex, store: RawFileStore, workerId: string, pollMs: number, log: (m: string) => void): void {
  if (globalForVideo.__stancelineVideoWake) return;
  let wake: (() => void) | null = null;
  globalForVideo.__stancelineVideoWake = () => wake?.();
  void (async () => {
    for (;;) {
      try {
        const ran = await runOneVideo(db, store, workerId);
        if (ran) {
          log(`video ${ran.id}: ${ran.status}`);
          continue;
        }
      } catch (error) {
        log(`video worker: ${error instanceof Error ? error.message : String(error)}`);
      }
      await new Promise<void>((resolve) => {
        const timer = setTimeout(done, pollMs);
        function done() {
          clearTimeout(timer);
          wake = null;
          resolve();
        }
        wake = done;
      });
    }
  })();
}

/** Nudges this process's video worker after an upload, if it runs here. */
export function wakeVideoWorker(): void {
  globalForVideo.__stancelineVideoWake?.();
}
