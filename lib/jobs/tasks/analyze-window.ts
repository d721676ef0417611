// The live lesson's per-step analysis (lib/live/analyze-window.ts) as a job-pool task, so a live session's rolling
// window is analysed on a worker thread and never stalls the requests of other users.
import { analyzeWindow, type AnalyzeWindowInput, type AnalyzeWindowOutput } from '@/lib/live/analyze-window';

export function analyzeWindowTask(input: AnalyzeWindowInput): AnalyzeWindowOutput {
  return analyzeWindow(input);
}
