// A worker in its own process, for the kill test (tests/lib/worker-kill.test.ts): the same startWorker the app runs,
// on the integration database, with a raw-file store whose reads are slowed down so a job stays running long enough
// to be killed mid-way. Run: node --import tsx tests/lib/support/worker-child.ts (env DATABASE_URL, STORE_DIR, WORKER_ID).
import { PassThrough } from 'node:stream';
import knex from 'knex';
import { knexConfig } from '@/knexfile';
import { startWorker } from '@/lib/jobs/worker';
import { createLocalStore } from '@/lib/storage/local';
import type { RawFileStore } from '@/lib/storage/types';

const local = createLocalStore(process.env.STORE_DIR!);
const slow: RawFileStore = {
  ...local,
  async read(key) {
    const source = await local.read(key);
    const out = new PassThrough();
    void (async () => {
      for await (const chunk of source) {
        await new Promise((resolve) => setTimeout(resolve, 250)); // 1 MiB per 250 ms
        out.write(chunk);
      }
      out.end();
    })();
    return out;
  },
};

const db = knex(knexConfig(process.env.DATABASE_URL));
startWorker({ db, store: slow, pollMs: 100, lockTimeoutS: 5, workerId: process.env.WORKER_ID });
console.log('worker started');
