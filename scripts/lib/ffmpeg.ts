// Debian's ffmpeg (with ffprobe) for the videos: installed with apt-get when missing, as MariaDB is (root only;
// otherwise says what to run).
import { existsSync } from 'node:fs';
import { runInherit } from './process';

export async function ensureFfmpegInstalled(log: (line: string) => void = console.log): Promise<void> {
  if (existsSync('/usr/bin/ffmpeg') && existsSync('/usr/bin/ffprobe')) return;
  const command = 'apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y ffmpeg';
  if (process.getuid?.() !== 0) throw new Error(`ffmpeg is not installed (/usr/bin/ffmpeg not found). Install it as root:\n  sudo sh -c '${command}'`);
  log('ffmpeg is not installed; installing the Debian package ffmpeg ...');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if ((await runInherit('apt-get', ['update'], { env })) !== 0) throw new Error(`apt-get update failed; run: ${command}`);
  if ((await runInherit('apt-get', ['install', '-y', 'ffmpeg'], { env })) !== 0 || !existsSync('/usr/bin/ffmpeg')) throw new Error(`installing ffmpeg failed; run: ${command}`);
}
