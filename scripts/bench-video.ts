// npm run bench:video (also the last step of npm run bench): the upload -> playable time of a 60 s, 1080p, 60 fps
// clip with sound (testsrc2 + impact clicks, made with Debian's ffmpeg as HEVC when the build has libx265, else H.264,
// like a phone's file), through the same file-to-file processing the worker runs (probe, playable mp4, poster, sync).
// Prints figures; asserts nothing about speed.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { cpus, tmpdir } from 'node:os';
import { join } from 'node:path';
import { processVideoFile } from '../lib/videos/process';

const dir = mkdtempSync(join(tmpdir(), 'stanceline-bench-video-'));
const input = join(dir, 'phone.mp4');
const impactsRec = [20, 33.5, 47.25]; // recording clock
const offset = -12.3; // video = recording + offset (construction)
const clicks = [3, ...impactsRec.map((t) => t + offset)];
const bursts = clicks.map((t) => `between(t,${t},${t + 0.03})*0.6*sin(2*PI*3000*(t-${t}))*exp(-abs(t-${t})*150)`).join('+');
const hasX265 = spawnSync('/usr/bin/ffmpeg', ['-hide_banner', '-encoders'], { encoding: 'utf8' }).stdout.includes('libx265');
const codec = hasX265 ? ['-c:v', 'libx265', '-preset', 'ultrafast', '-tag:v', 'hvc1'] : ['-c:v', 'libx264', '-preset', 'ultrafast'];
let t0 = performance.now();
const made = spawnSync('/usr/bin/ffmpeg', ['-v', 'error', '-y', '-f', 'lavfi', '-i', 'testsrc2=size=1920x1080:rate=60:duration=60', '-f', 'lavfi', '-i', `aevalsrc=exprs='${bursts}+0.02*(random(0)*2-1)':s=48000:d=60`, ...codec, '-pix_fmt', 'yuv420p', '-c:a', 'aac', '-shortest', input], { encoding: 'utf8' });
if (made.status !== 0) throw new Error(made.stderr);
console.log(`bench:video  made the clip (${hasX265 ? 'HEVC' : 'H.264'}, 60 s, 1920x1080, 60 fps, ${(statSync(input).size / 1e6).toFixed(1)} MB) in ${((performance.now() - t0) / 1000).toFixed(1)} s on ${cpus().length} cores`);
t0 = performance.now();
const out = await processVideoFile(input, join(dir, 'playable.mp4'), join(dir, 'poster.jpg'), impactsRec);
const s = (performance.now() - t0) / 1000;
console.log(`bench:video  upload -> playable (probe, H.264/AAC mp4, poster, sound sync): ${s.toFixed(1)} s (${(60 / s).toFixed(2)}x real time)`);
console.log(`bench:video  offset found ${out.offsetS?.toFixed(4)} s, constructed ${offset} s, source ${out.syncSource}; playable ${(statSync(join(dir, 'playable.mp4')).size / 1e6).toFixed(1)} MB`);
rmSync(dir, { recursive: true, force: true });
