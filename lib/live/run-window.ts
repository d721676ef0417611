// The one place a live analysis step runs: on the job pool's worker threads (lib/jobs/pool.ts), like the analysis of
// an upload, so live processing never stalls other requests. analyzeWindow's input and output are structured-clone
// friendly; tests that need no threads call analyzeWindow itself.
import { runTask } from '@/lib/jobs/pool';
import type { AnalyzeWindowInput, AnalyzeWindowOutput } from './analyze-window';

export async function runAnalyzeWindow(input: AnalyzeWindowInput): Promise<AnalyzeWindowOutput> {
  return runTask('analyze-window', input);
}
