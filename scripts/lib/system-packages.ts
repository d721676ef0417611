// What `npm test` needs from Debian besides Node: MariaDB (the throwaway database), chromium (the browser tests),
// ffmpeg (the video tests) and python3 with scipy and pandas (reference values). Installed with apt-get when missing,
// as `npm start` does for MariaDB (root only; otherwise the error says what to run), so `npm ci && npm test` works on
// a machine that has only Node.
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { runInherit } from './process';

interface Need {
  present: () => boolean;
  packages: string[];
}

const NEEDS: Need[] = [
  { present: () => existsSync('/usr/sbin/mariadbd'), packages: ['mariadb-server', 'mariadb-client'] },
  { present: () => existsSync(process.env.CHROMIUM_PATH ?? '/usr/bin/chromium'), packages: ['chromium'] },
  { present: () => existsSync('/usr/bin/ffmpeg') && existsSync('/usr/bin/ffprobe'), packages: ['ffmpeg'] },
  {
    present: () => spawnSync('/usr/bin/python3', ['-c', 'import scipy, pandas'], { stdio: 'ignore' }).status === 0,
    packages: ['python3-scipy', 'python3-pandas'],
  },
];

/** The Debian packages the tests need that this machine lacks. */
export function missingTestPackages(): string[] {
  return NEEDS.filter((need) => !need.present()).flatMap((need) => need.packages);
}

/**
 * THE apt-get step of the scripts (MariaDB for npm start, ffmpeg, the test packages): installs `packages` as root, or
 * throws with the command to run; `present` is checked again afterwards.
 */
export async function installDebianPackages(
  packages: readonly string[],
  what: string,
  present: () => boolean,
  log: (line: string) => void = console.log,
): Promise<void> {
  const command = `apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y ${packages.join(' ')}`;
  if (process.getuid?.() !== 0) throw new Error(`${what} is not installed. Install it as root:\n  sudo sh -c '${command}'`);
  log(`${what} is not installed; installing the Debian packages ${packages.join(' ')} ...`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if ((await runInherit('apt-get', ['update'], { env })) !== 0) throw new Error(`apt-get update failed; run: ${command}`);
  if ((await runInherit('apt-get', ['install', '-y', ...packages], { env })) !== 0 || !present()) {
    throw new Error(`installing ${what} failed; run: ${command}`);
  }
}

export async function ensureTestPackages(log: (line: string) => void = console.log): Promise<void> {
  const missing = missingTestPackages();
  if (missing.length === 0) return;
  await installDebianPackages(missing, `what the tests need (${missing.join(', ')})`, () => missingTestPackages().length === 0, log);
}
