// The bridge for demos and tests (README "Live lessons"):
//   npm run live:replay -- FILE --url URL --token T [--speed 1]
// URL is the live session's address (http://host/api/live/ID) or its samples address. Streams FILE in ~100 ms
// chunks paced by its time column (speed 10 = ten times faster), retrying each chunk until the server stores it.
import { readFileSync } from 'node:fs';
import { replay } from './lib/live-bridge';

const USAGE = 'usage: npm run live:replay -- FILE --url URL --token T [--speed 1]';

function parse(argv: string[]): { file: string; url: string; token: string; speed: number } {
  let file: string | undefined;
  let url: string | undefined;
  let token: string | undefined;
  let speed = 1;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--url') url = argv[++i];
    else if (a === '--token') token = argv[++i];
    else if (a === '--speed') speed = Number(argv[++i]);
    else if (a.startsWith('--')) throw new Error(`unknown option ${a}`);
    else if (file === undefined) file = a;
    else throw new Error(`unexpected argument ${a}`);
  }
  if (!file || !url || !token) throw new Error('FILE, --url and --token are required');
  if (!(speed > 0 && speed <= 1000)) throw new Error('--speed must be a number above 0 (at most 1000)');
  return { file, url, token, speed };
}

async function main(): Promise<void> {
  let args;
  try {
    args = parse(process.argv.slice(2));
  } catch (error) {
    console.error(`${(error as Error).message}\n${USAGE}`);
    process.exit(2);
  }
  const csv = readFileSync(args.file, 'utf8');
  const r = await replay(csv, { url: args.url, token: args.token, speed: args.speed, log: (l) => console.error(l) });
  console.log(JSON.stringify(r));
  process.exit(r.refused.length ? 1 : 0);
}

void main().catch((error) => {
  console.error((error as Error).message);
  process.exit(1);
});
