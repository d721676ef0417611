// The one place a live analysis step runs. Today it runs inline; this is the seam where it is routed through the
// worker-thread pool (lib/jobs/pool.ts, issue 13) at merge: analyzeWindow's input and output are structured-clone
// friendly, so `pool.run('analyze-window', input)` replaces the direct call without other changes.
import { analyzeWindow, type AnalyzeWindowInput, type AnalyzeWindowOutput } from './analyze-window';

export async function runAnalyzeWindow(input: AnalyzeWindowInput): Promise<AnalyzeWindowOutput> {
  return analyzeWindow(input);
}
