'use client';

import { z } from 'zod';

// Zod probes `new Function` once to decide whether it may compile fast parsers. Under the pages' nonce CSP (proxy.ts)
// that probe is refused and reported as a CSP violation even though zod catches it; `jitless` skips the probe.
// Module level, so it runs when the client bundle loads, before any form or fetcher parses.
z.config({ jitless: true });

export function ZodJitless(): null {
  return null;
}
