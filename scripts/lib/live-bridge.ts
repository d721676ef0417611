// A bridge as the insoles' phone or laptop would run it: a recording split into ~100 ms chunks (chunk 0 carries the
// metadata lines and the header row), each POSTed to /api/live/:id/samples with the bearer token and X-Chunk-Seq,
// paced by the file's own time column / speed. A chunk is retried until the server stores it (network error, 5xx:
// the app may be restarting); a 400 is reported and its sequence number is reused for the next chunk.

export interface BridgeOptions {
  url: string;
  token: string;
  speed: number;
  chunkS?: number;
  /** give up on one chunk after this long, ms */
  retryForMs?: number;
  log?: (line: string) => void;
  /** called after each stored chunk with the wall time it was acknowledged (ms) and the chunk's last row time */
  onAck?: (seq: number, lastS: number, ackedAt: number) => void;
  /** called just before each chunk's first attempt, with the chunk's index and the wall time (ms) */
  onSend?: (index: number, sentAt: number) => void;
}

export interface BridgeResult {
  chunks: number;
  refused: { seq: number; status: number; body: string }[];
  retries: number;
}

export function splitRecording(csv: string, chunkS = 0.1): { chunks: string[]; lastTimes: number[] } {
  const lines = csv.replace(/\r\n/g, '\n').split('\n');
  let h = 0;
  while (h < lines.length && (lines[h].trim() === '' || lines[h].startsWith('#'))) h++;
  const preamble = lines.slice(0, h + 1).join('\n') + '\n';
  const delimiter = lines[h]?.includes('\t') ? '\t' : lines[h]?.includes(';') ? ';' : ',';
  const rows = lines.slice(h + 1).filter((l) => l.trim() !== '');
  const times = rows.map((r) => Number(r.split(delimiter)[0].replace(',', '.')));
  const chunks: string[] = [];
  const lastTimes: number[] = [];
  let i = 0;
  while (i < rows.length) {
    let j = i + 1;
    while (j < rows.length && times[j] < times[i] + chunkS - 1e-9) j++;
    chunks.push((chunks.length === 0 ? preamble : '') + rows.slice(i, j).map((r) => `${r}\n`).join(''));
    lastTimes.push(times[j - 1]);
    i = j;
  }
  return { chunks, lastTimes };
}

export function samplesUrl(url: string): string {
  const u = url.replace(/\/+$/, '');
  return u.endsWith('/samples') ? u : `${u}/samples`;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function replay(csv: string, o: BridgeOptions): Promise<BridgeResult> {
  const { chunks, lastTimes } = splitRecording(csv, o.chunkS);
  const target = samplesUrl(o.url);
  const log = o.log ?? (() => undefined);
  const t0 = Date.now();
  const s0 = lastTimes[0] ?? 0;
  const result: BridgeResult = { chunks: 0, refused: [], retries: 0 };
  let seq = 0;
  for (let k = 0; k < chunks.length; k++) {
    const due = t0 + ((lastTimes[k] - s0) * 1000) / o.speed - Date.now();
    if (due > 0) await sleep(due);
    o.onSend?.(k, Date.now());
    const give = Date.now() + (o.retryForMs ?? 120_000);
    let backoff = 100;
    for (;;) {
      let status = 0;
      let body = '';
      try {
        const res = await fetch(target, {
          method: 'POST',
          headers: { authorization: `Bearer ${o.token}`, 'content-type': 'text/csv', 'x-chunk-seq': String(seq) },
          body: chunks[k],
        });
        status = res.status;
        body = await res.text();
      } catch (error) {
        body = (error as Error).message;
      }
      if (status === 202) {
        o.onAck?.(seq, lastTimes[k], Date.now());
        result.chunks++;
        seq++;
        break;
      }
      if (status >= 400 && status < 500) {
        log(`chunk ${seq} refused (${status}): ${body}`);
        result.refused.push({ seq, status, body });
        if (status === 401) return result; // the live session ended or the token is wrong: stop
        break;
      }
      if (Date.now() > give) throw new Error(`chunk ${seq}: no answer from ${target} for ${(o.retryForMs ?? 120_000) / 1000} s (last: ${status || body})`);
      result.retries++;
      await sleep(backoff);
      backoff = Math.min(2000, backoff * 2);
    }
  }
  return result;
}
