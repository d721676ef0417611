// Task "process-job": one claimed processing job, whole (read the stored file, analyse, write the results in one
// transaction), on a job thread with the thread's own database connections and store client, both opened from plain
// data on the thread's first job and kept for its life. The server's worker loop (lib/jobs/worker.ts) only claims
// the job and keeps its heartbeat going while this runs.
import type { Knex } from 'knex';
import { createKnex } from '@/lib/db/connection';
import { storeFromConfig, type RawFileStore, type StoreConfig } from '@/lib/storage';
import type { ClaimedJob } from '../queue';
import { processClaimedJob, type Verdict } from '../process-recording';

export interface ProcessJobPayload {
  job: ClaimedJob;
  workerId: string;
  databaseUrl: string;
  store: StoreConfig;
  /** the upload spool folder, where a kept copy of the raw file may wait */
  localCopyDir?: string;
}

/** A small pool per thread: one transaction at a time, plus the reads before it. */
const THREAD_POOL_MAX = 2;

const clients = new Map<string, Knex>();
const stores = new Map<string, RawFileStore>();

function threadDb(databaseUrl: string): Knex {
  let db = clients.get(databaseUrl);
  if (!db) clients.set(databaseUrl, (db = createKnex(databaseUrl, THREAD_POOL_MAX)));
  return db;
}

function threadStore(config: StoreConfig): RawFileStore {
  const key = JSON.stringify(config);
  let store = stores.get(key);
  if (!store) stores.set(key, (store = storeFromConfig(config)));
  return store;
}

export function processJobTask(payload: ProcessJobPayload): Promise<Verdict> {
  return processClaimedJob(threadDb(payload.databaseUrl), threadStore(payload.store), payload.job, payload.workerId, { localCopyDir: payload.localCopyDir });
}
