// Sharp sound onsets (the click of a club striking a ball) in mono PCM, and the offset that lines them up with the
// swings' impact times.
//
// Envelope: mean square over a short window (windowS, 4 ms) every hopS (1 ms), from a running sum of squares.
// Noise floor: the median of the envelope over the whole clip (a clip is mostly not impacts, so the median is the
// background: wind, talking, traffic). Threshold: the floor raised by `riseDb` (common practice for transient
// detection: an onset stands well above the background, here 20 dB by default), and never below an absolute level
// `minLevelDb` (dBFS) so a clip of pure digital silence does not call its first rustle an impact.
// An onset is the first hop whose envelope crosses the threshold upward; the time is refined to the first sample in
// that window whose square reaches the threshold. After an onset, `refractoryS` passes before the next one (the ring
// of one strike is not a second strike).
//
// Pure: arrays in, new objects out; bad parameters throw RangeError.
import { alignIntervals } from './align-intervals';

export interface OnsetOptions {
  windowS: number;
  hopS: number;
  riseDb: number;
  minLevelDb: number;
  refractoryS: number;
}

export const ONSET_DEFAULTS: OnsetOptions = { windowS: 0.004, hopS: 0.001, riseDb: 20, minLevelDb: -50, refractoryS: 0.3 };

export interface Onset {
  /** seconds from the first sample */
  timeS: number;
  /** the envelope's peak within the next 50 ms, dB above the noise floor */
  strengthDb: number;
}

export interface OnsetResult {
  onsets: Onset[];
  /** the noise floor as an RMS level, dBFS */
  noiseFloorDb: number;
}

const db = (meanSquare: number) => 10 * Math.log10(Math.max(meanSquare, 1e-20));

export function detectOnsets(pcm: Float32Array, sampleRate: number, options: Partial<OnsetOptions> = {}): OnsetResult {
  const o = { ...ONSET_DEFAULTS, ...options };
  if (!(sampleRate > 0)) throw new RangeError('sampleRate must be > 0');
  if (!(o.windowS > 0 && o.hopS > 0 && o.refractoryS >= 0)) throw new RangeError('windowS and hopS must be > 0, refractoryS >= 0');
  const win = Math.max(1, Math.round(o.windowS * sampleRate));
  const hop = Math.max(1, Math.round(o.hopS * sampleRate));
  if (pcm.length < win) return { onsets: [], noiseFloorDb: db(0) };

  const cum = new Float64Array(pcm.length + 1);
  for (let i = 0; i < pcm.length; i++) cum[i + 1] = cum[i] + pcm[i] * pcm[i];
  const frames = Math.floor((pcm.length - win) / hop) + 1;
  const env = new Float64Array(frames);
  for (let f = 0; f < frames; f++) env[f] = (cum[f * hop + win] - cum[f * hop]) / win;

  const sorted = Float64Array.from(env).sort();
  const floor = sorted[Math.floor(sorted.length / 2)];
  const threshold = Math.max(floor * 10 ** (o.riseDb / 10), 10 ** (o.minLevelDb / 10));
  const peakFrames = Math.max(1, Math.round(0.05 / o.hopS));
  const refractory = Math.round(o.refractoryS * sampleRate);

  const onsets: Onset[] = [];
  let nextAllowed = 0;
  for (let f = 1; f < frames; f++) {
    if (!(env[f] >= threshold && env[f - 1] < threshold)) continue;
    const start = f * hop;
    if (start < nextAllowed) continue;
    let at = start + win - 1;
    for (let i = start; i < start + win; i++) {
      if (pcm[i] * pcm[i] >= threshold) {
        at = i;
        break;
      }
    }
    let peak = env[f];
    for (let g = f; g < Math.min(frames, f + peakFrames); g++) peak = Math.max(peak, env[g]);
    onsets.push({ timeS: at / sampleRate, strengthDb: db(peak) - db(floor) });
    nextAllowed = at + refractory;
  }
  return { onsets, noiseFloorDb: db(floor) };
}

export interface AudioSyncResult {
  /** video time = recording time + offsetS; null when the sound gives no answer */
  offsetS: number | null;
  /** impacts matched to onsets */
  matched: number;
  /** why there is no answer, in coach words */
  reason: string | null;
}

/**
 * The offset from onsets (video clock) and impacts (recording clock). Two or more impacts: the interval pattern
 * (alignIntervals) so talking and extra clicks do not fool it; at least two must match. One impact: the strongest
 * onset, which is the best a single interval-free event allows.
 */
export function syncByAudio(onsetTimesS: readonly number[], strengthsDb: readonly number[], impactTimesS: readonly number[], toleranceS = 0.05): AudioSyncResult {
  if (onsetTimesS.length !== strengthsDb.length) throw new RangeError('onsetTimesS and strengthsDb must have the same length');
  if (onsetTimesS.length === 0) return { offsetS: null, matched: 0, reason: 'No impact sound was found in the video’s audio.' };
  if (impactTimesS.length === 0) return { offsetS: null, matched: 0, reason: 'The recording has no swings with an impact to line up with.' };
  if (impactTimesS.length === 1) {
    let best = 0;
    for (let i = 1; i < strengthsDb.length; i++) if (strengthsDb[i] > strengthsDb[best]) best = i;
    return { offsetS: onsetTimesS[best] - impactTimesS[0], matched: 1, reason: null };
  }
  const aligned = alignIntervals(onsetTimesS, impactTimesS, { toleranceS }, 2);
  if (aligned.offsetS === null) return { offsetS: null, matched: 0, reason: 'The impact sounds do not line up with the swings’ impacts.' };
  return { offsetS: aligned.offsetS, matched: aligned.matched, reason: null };
}
