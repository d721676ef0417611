// Video processing on files made here with Debian's ffmpeg: a testsrc picture and an audio track of sine-burst
// clicks at times we choose (aevalsrc is sample-exact, so the truth is the expression's own times, never a detector
// threshold), with background noise and one extra click that is not an impact.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { detectOnsets } from '@/lib/signal/audio-onsets';
import { VideoInputError, probeVideo } from '@/lib/videos/ffmpeg';
import { processVideoFile } from '@/lib/videos/process';

const dir = mkdtempSync(join(tmpdir(), 'stanceline-video-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** A 3 kHz burst decaying over ~10 ms, starting at each time; uniform noise at -40 dBFS RMS-ish underneath. */
function clickExpr(times: number[], amp = 0.6): string {
  const bursts = times.map((t) => `between(t,${t},${t + 0.03})*${amp}*sin(2*PI*3000*(t-${t}))*exp(-abs(t-${t})*150)`);
  return `${bursts.join('+')}+0.02*(random(0)*2-1)`;
}

function makeVideo(name: string, fps: number, durationS: number, clicks: number[] | null): string {
  const path = join(dir, name);
  const args = ['-v', 'error', '-y', '-f', 'lavfi', '-i', `testsrc=size=320x240:rate=${fps}:duration=${durationS}`];
  if (clicks) args.push('-f', 'lavfi', '-i', `aevalsrc=exprs='${clickExpr(clicks)}':s=48000:d=${durationS}`);
  args.push('-c:v', 'libx264', '-preset', 'ultrafast', '-pix_fmt', 'yuv420p');
  if (clicks) args.push('-c:a', 'aac', '-shortest');
  args.push(path);
  const res = spawnSync('/usr/bin/ffmpeg', args, { encoding: 'utf8' });
  if (res.status !== 0) throw new Error(res.stderr);
  return path;
}

// Recording clock: three impacts with unequal intervals (1.3 s, 1.8 s). Video clock = recording clock + OFFSET.
const IMPACTS = [10.0, 11.3, 13.1];
const OFFSET = -8.237;
const EXTRA_CLICK = 0.9; // a club tapped on the ground before the first swing: not an impact

describe('processVideoFile on generated clips', () => {
  for (const fps of [30, 60, 120]) {
    it(`finds the offset within one frame at ${fps} fps, ignoring an extra click and noise`, async () => {
      const clicks = [EXTRA_CLICK, ...IMPACTS.map((t) => t + OFFSET)];
      const input = makeVideo(`clicks-${fps}.mp4`, fps, 6, clicks);
      const out = await processVideoFile(input, join(dir, `play-${fps}.mp4`), join(dir, `poster-${fps}.jpg`), IMPACTS);
      expect(out.syncSource).toBe('audio');
      expect(out.offsetS).not.toBeNull();
      // The requirement: within one frame.
      expect(Math.abs(out.offsetS! - OFFSET)).toBeLessThan(1 / fps);
      expect(out.probe.fps).toBeCloseTo(fps, 3);
      expect(out.probe.durationS).toBeGreaterThan(5.9);
      // The playable file is H.264 + AAC at the same rate, and the poster is a JPEG (FF D8 magic, JFIF/ISO 10918-1).
      const playable = await probeVideo(join(dir, `play-${fps}.mp4`));
      expect(playable.codec).toBe('h264');
      expect(playable.hasAudio).toBe(true);
      expect(playable.fps).toBeCloseTo(fps, 3);
      expect([...readFileSync(join(dir, `poster-${fps}.jpg`)).subarray(0, 2)]).toEqual([0xff, 0xd8]);
    });
  }

  it('finds every click, the extra one included, each within a millisecond of its start', async () => {
    const clicks = [EXTRA_CLICK, ...IMPACTS.map((t) => t + OFFSET)];
    const input = makeVideo('clicks-onsets.mp4', 30, 6, clicks);
    const out = await processVideoFile(input, join(dir, 'p.mp4'), join(dir, 'p.jpg'), IMPACTS);
    expect(out.onsetTimesS).toHaveLength(clicks.length);
    // AAC adds priming samples that ffmpeg trims on decode; 2 ms covers the burst's first rising cycle (3 kHz).
    out.onsetTimesS.forEach((t, i) => expect(Math.abs(t - clicks[i])).toBeLessThan(0.002));
  });

  it('a clip with no audio track gets syncSource null and asks for manual sync', async () => {
    const input = makeVideo('silent.mp4', 60, 2, null);
    const out = await processVideoFile(input, join(dir, 'silent-play.mp4'), join(dir, 'silent.jpg'), IMPACTS);
    expect(out.syncSource).toBeNull();
    expect(out.offsetS).toBeNull();
    expect(out.syncNote).toMatch(/This is impact/);
    expect(statSync(join(dir, 'silent-play.mp4')).size).toBeGreaterThan(0);
  });

  it('a file that is not a video fails with its reason', async () => {
    const path = join(dir, 'notes.mp4');
    writeFileSync(path, 'these are lesson notes, not a video\n');
    await expect(processVideoFile(path, join(dir, 'x.mp4'), join(dir, 'x.jpg'), IMPACTS)).rejects.toThrow(VideoInputError);
    await expect(processVideoFile(path, join(dir, 'x.mp4'), join(dir, 'x.jpg'), IMPACTS)).rejects.toThrow(/could not be read as a video/);
  });

  it('a truncated video fails with its reason', async () => {
    const whole = readFileSync(makeVideo('whole.mov', 30, 2, [0.5]));
    const path = join(dir, 'cut.mov');
    writeFileSync(path, whole.subarray(0, Math.floor(whole.length / 3)));
    await expect(processVideoFile(path, join(dir, 'y.mp4'), join(dir, 'y.jpg'), IMPACTS)).rejects.toThrow(VideoInputError);
  });
});

describe('detectOnsets', () => {
  it('finds nothing in pure noise (a threshold relative to the clip’s own floor)', () => {
    // Deterministic uniform noise from a linear congruential generator (Numerical Recipes' constants).
    let s = 12345;
    const pcm = new Float32Array(16000 * 3).map(() => {
      s = (1664525 * s + 1013904223) >>> 0;
      return 0.05 * ((s / 2 ** 32) * 2 - 1);
    });
    expect(detectOnsets(pcm, 16000).onsets).toEqual([]);
  });
});
