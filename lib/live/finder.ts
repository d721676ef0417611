// The incremental swing finder: a rolling buffer of the stream's rows, scanned every `scanEveryS` of stream time by
// the offline pipeline itself (analyzeWindow -> analyzeRecording), so live and offline cannot disagree by design.
// A swing is published once, when its finish has settled with `padAfterS` of data after the hold; swings come out in time
// order because the buffer only grows forward and everything up to the last published impact is skipped.
// No I/O, no clock: lib/live/processor.ts feeds it from the stored chunks.
import type { AnalyzeOptions } from '@/lib/signal/analyze';
import { detectDelimiter } from '@/lib/signal/read/cells';
import type { SensorLayout } from '@/lib/signal/types';
import { SAME_SWING_S, type AnalyzeWindowInput, type AnalyzeWindowOutput, type LiveSwing } from './analyze-window';

export const LIVE_DEFAULTS = {
  /** stream time kept in the rolling buffer, s: a swing from a still address to a settled finish fits several times */
  windowS: 12,
  /** how often the buffer is scanned, s of stream time (a settled swing waits at most this long) */
  scanEveryS: 0.2,
  /** data on each side of a swing for the zero-lag filter and the finder's context, s. sosfiltfilt's start-up
   *  transient of a 4th-order 10 Hz Butterworth at 100 Hz has died out well within this (the offline filter pads
   *  too); the equality test against the offline analysis is the check */
  padBeforeS: 1.5,
  /** after the finish hold, waited for after every swing, so kept small: the finder itself only settles a finish
   *  once its hold is in the buffer, and on the equality test's sessions 0 s already gave identical events and
   *  values; 0.1 s is a margin for the zero-lag filter's end effect at the finish */
  padAfterS: 0.1,
} as const;

export interface LiveFinderConfig {
  preamble: string;
  layout: SensorLayout;
  options: AnalyzeWindowInput['options'];
  windowS?: number;
  scanEveryS?: number;
  padBeforeS?: number;
  padAfterS?: number;
}

interface Row {
  t: number;
  text: string;
}

export class LiveFinder {
  private rows: Row[] = [];
  private readonly delimiter: string;
  private readonly decimalComma: boolean;
  private lastScanS = -Infinity;
  private publishedUntilS = -Infinity;
  private firstS: number | null = null;
  private droppedAny = false;
  readonly cfg: Required<Omit<LiveFinderConfig, 'options'>> & { options: AnalyzeOptions };

  constructor(cfg: LiveFinderConfig) {
    this.cfg = { ...LIVE_DEFAULTS, ...cfg };
    const header = cfg.preamble.split('\n').filter((l) => l.trim() !== '' && !l.startsWith('#')).pop() ?? '';
    this.delimiter = detectDelimiter(header);
    this.decimalComma = this.delimiter === ';';
  }

  /** Continue after a restart: swings up to this impact time were published already. */
  resumeAfter(impactS: number): void {
    this.publishedUntilS = Math.max(this.publishedUntilS, impactS);
  }

  /** Adds the data rows of one chunk (already validated by the ingest). */
  push(body: string): void {
    for (const line of body.split('\n')) {
      const text = line.endsWith('\r') ? line.slice(0, -1) : line;
      if (text.trim() === '') continue;
      const cut = text.indexOf(this.delimiter);
      const cell = (cut < 0 ? text : text.slice(0, cut)).trim();
      const t = Number(this.decimalComma ? cell.replace(',', '.') : cell);
      if (!Number.isFinite(t)) continue;
      if (this.firstS === null) this.firstS = t;
      this.rows.push({ t, text });
    }
    const keepFrom = this.lastS() - this.cfg.windowS;
    let drop = 0;
    while (drop < this.rows.length && this.rows[drop].t < keepFrom) drop++;
    if (drop > 0) {
      this.rows.splice(0, drop);
      this.droppedAny = true;
    }
  }

  lastS(): number {
    return this.rows.length ? this.rows[this.rows.length - 1].t : -Infinity;
  }

  /** The next scan's input when one is due (and there is enough data for the pipeline), else null. */
  scanDue(force = false): AnalyzeWindowInput | null {
    // the pipeline needs a couple of seconds (filter padding, derivative window, address stillness)
    if (this.rows.length < 2 || this.lastS() - this.rows[0].t < 2) return null;
    if (!force && this.lastS() - this.lastScanS < this.cfg.scanEveryS) return null;
    this.lastScanS = this.lastS();
    return {
      preamble: this.cfg.preamble,
      body: this.rows.map((r) => r.text + '\n').join(''),
      layout: this.cfg.layout,
      options: this.cfg.options,
      publishedUntilS: this.publishedUntilS,
      padBeforeS: this.cfg.padBeforeS,
      padAfterS: this.cfg.padAfterS,
      atStreamStart: !this.droppedAny,
    };
  }

  /** Takes a scan's result; returns the swings to publish now, in order, each once. */
  accept(out: AnalyzeWindowOutput): LiveSwing[] {
    const fresh = out.swings.filter((w) => w.events.impact > this.publishedUntilS + SAME_SWING_S).sort((a, b) => a.events.impact - b.events.impact);
    if (fresh.length) this.publishedUntilS = fresh[fresh.length - 1].events.impact;
    return fresh;
  }

  /** Stream time of the first sample (the event times' origin on the client). */
  streamStartS(): number | null {
    return this.firstS;
  }
}
