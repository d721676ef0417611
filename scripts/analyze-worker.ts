// The worker thread of the analyze command's two-thread reader (scripts/analyze-parallel.ts), bundled on its own
// (.build/analyze-worker.mjs) so that it starts without loading the analysis.
import { runParseWorker } from './analyze-parallel';

runParseWorker();
