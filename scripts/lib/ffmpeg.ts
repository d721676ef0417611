// Debian's ffmpeg (with ffprobe) for the videos: installed with apt-get when missing, as MariaDB is (root only;
// otherwise says what to run).
import { existsSync } from 'node:fs';
import { installDebianPackages } from './system-packages';

export async function ensureFfmpegInstalled(log: (line: string) => void = console.log): Promise<void> {
  const present = () => existsSync('/usr/bin/ffmpeg') && existsSync('/usr/bin/ffprobe');
  if (!present()) await installDebianPackages(['ffmpeg'], 'ffmpeg (/usr/bin/ffmpeg)', present, log);
}
