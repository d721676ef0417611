// Debian's ffmpeg/ffprobe as child processes: probe, browser-playable mp4, poster frame, PCM for the sync.
// The heavy work happens in the child process, never on the event loop.
import { spawn } from 'node:child_process';

export const FFMPEG = process.env.FFMPEG_PATH ?? '/usr/bin/ffmpeg';
export const FFPROBE = process.env.FFPROBE_PATH ?? '/usr/bin/ffprobe';

/** A file that is not a video, or is corrupt: the message is shown to the coach. */
export class VideoInputError extends Error {
  override name = 'VideoInputError';
}

interface RunResult {
  code: number | null;
  stdout: Buffer;
  stderr: string;
}

function run(cmd: string, args: string[]): Promise<RunResult> {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, args, { stdio: ['ignore', 'pipe', 'pipe'] });
    const out: Buffer[] = [];
    let err = '';
    child.stdout.on('data', (chunk: Buffer) => out.push(chunk));
    child.stderr.on('data', (chunk: Buffer) => {
      err = (err + chunk.toString('utf8')).slice(-4000);
    });
    child.on('error', reject);
    child.on('close', (code) => resolve({ code, stdout: Buffer.concat(out), stderr: err }));
  });
}

/** The last meaningful line of ffmpeg's stderr, short, for a reason shown to people. */
function lastLine(stderr: string): string {
  const lines = stderr.split('\n').map((l) => l.trim()).filter(Boolean);
  return (lines.at(-1) ?? 'no output').slice(0, 200);
}

export interface VideoProbe {
  fps: number;
  durationS: number;
  /** degrees clockwise the picture must be turned for display (0, 90, 180, 270) */
  rotation: number;
  width: number;
  height: number;
  codec: string;
  hasAudio: boolean;
  /** start of the audio stream minus start of the video stream, seconds (0 for most phone files) */
  audioLeadS: number;
}

function rate(text: string | undefined): number {
  if (!text) return NaN;
  const [n, d] = text.split('/').map(Number);
  return d ? n / d : n;
}

export async function probeVideo(path: string): Promise<VideoProbe> {
  const res = await run(FFPROBE, ['-v', 'error', '-print_format', 'json', '-show_streams', '-show_format', path]);
  if (res.code !== 0) throw new VideoInputError(`This file could not be read as a video (${lastLine(res.stderr)}).`);
  type Stream = { codec_type?: string; codec_name?: string; avg_frame_rate?: string; r_frame_rate?: string; width?: number; height?: number; duration?: string; start_time?: string; tags?: { rotate?: string }; side_data_list?: { rotation?: number }[] };
  const info = JSON.parse(res.stdout.toString('utf8')) as { streams?: Stream[]; format?: { duration?: string } };
  const streams = info.streams ?? [];
  const video = streams.find((s) => s.codec_type === 'video' && s.codec_name !== 'mjpeg' && s.codec_name !== 'png');
  if (!video) throw new VideoInputError('This file has no video picture (it may be an audio file or an image).');
  const audio = streams.find((s) => s.codec_type === 'audio');
  let fps = rate(video.avg_frame_rate);
  if (!(fps > 0)) fps = rate(video.r_frame_rate);
  const durationS = Number(video.duration ?? info.format?.duration);
  if (!(fps > 0) || !(durationS > 0)) throw new VideoInputError('The video’s frame rate or duration could not be read: the file may be cut short or corrupt.');
  const rawRotation = video.side_data_list?.find((d) => typeof d.rotation === 'number')?.rotation ?? Number(video.tags?.rotate ?? 0);
  // Display-matrix rotation is counter-clockwise and negative for a phone held upright; report it clockwise.
  const rotation = (((-rawRotation % 360) + 360) % 360) || 0;
  const vStart = Number(video.start_time ?? 0) || 0;
  const aStart = Number(audio?.start_time ?? vStart) || 0;
  return { fps, durationS, rotation, width: video.width ?? 0, height: video.height ?? 0, codec: video.codec_name ?? 'unknown', hasAudio: Boolean(audio), audioLeadS: aStart - vStart };
}

/**
 * H.264 (yuv420p, plays in every current browser) + AAC, a keyframe at least every `keyframeEvery` frames so
 * scrubbing lands on a frame quickly, moov atom first (+faststart) so playback starts before the whole file arrives.
 * The frame rate is kept (a 240 fps clip stays 240 fps: slow motion is the point). ffmpeg applies the rotation.
 */
export async function transcodePlayable(input: string, output: string, hasAudio: boolean, keyframeEvery = 10): Promise<void> {
  const args = ['-v', 'error', '-y', '-i', input, '-map', '0:v:0'];
  if (hasAudio) args.push('-map', '0:a:0', '-c:a', 'aac', '-b:a', '128k');
  args.push('-c:v', 'libx264', '-preset', 'veryfast', '-crf', '23', '-pix_fmt', 'yuv420p', '-g', String(keyframeEvery), '-keyint_min', String(keyframeEvery), '-sc_threshold', '0');
  args.push('-vf', 'scale=trunc(iw/2)*2:trunc(ih/2)*2', '-movflags', '+faststart', '-f', 'mp4', output);
  const res = await run(FFMPEG, args);
  if (res.code !== 0) throw new VideoInputError(`The video could not be converted: it may be corrupt (${lastLine(res.stderr)}).`);
}

/** One JPEG frame from a quarter of the way in, at most 640 px wide. */
export async function makePoster(input: string, output: string, durationS: number): Promise<void> {
  const at = Math.max(0, Math.min(durationS / 4, durationS - 0.05));
  const res = await run(FFMPEG, ['-v', 'error', '-y', '-ss', at.toFixed(3), '-i', input, '-frames:v', '1', '-vf', "scale='min(640,iw)':-2", '-q:v', '4', output]);
  if (res.code !== 0) throw new VideoInputError(`No picture could be taken from the video (${lastLine(res.stderr)}).`);
}

export const PCM_RATE = 16_000;

/** The first audio track, mono float32 at PCM_RATE; null when the file has no audio or it cannot be decoded. */
export async function extractPcm(input: string): Promise<Float32Array | null> {
  const res = await run(FFMPEG, ['-v', 'error', '-i', input, '-map', '0:a:0', '-vn', '-ac', '1', '-ar', String(PCM_RATE), '-f', 'f32le', '-']);
  if (res.code !== 0 || res.stdout.length < 4) return null;
  const bytes = res.stdout;
  const copy = new ArrayBuffer(bytes.length - (bytes.length % 4));
  new Uint8Array(copy).set(bytes.subarray(0, copy.byteLength));
  return new Float32Array(copy);
}
