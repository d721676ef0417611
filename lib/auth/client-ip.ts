// The client address for per-IP sign-in throttling.
//
// Without a trusted reverse proxy (TRUST_PROXY unset or false), X-Forwarded-For is whatever the client wrote: `next
// start` only fills it in when it is absent. So the address of the TCP peer is stamped on every request, under a
// header of our own that overwrites anything a client sent, before Next sees the request (installPeerAddressHeader,
// called once from instrumentation.ts), and that is the address used.
// With TRUST_PROXY=true the app runs behind exactly one reverse proxy that sets or appends X-Forwarded-For; the last
// entry is then the address the proxy itself saw, the one part of the header a client cannot choose.
import type { IncomingMessage, Server } from 'node:http';

export const PEER_ADDRESS_HEADER = 'x-stanceline-peer-address';

type Headers = Record<string, string | string[] | undefined> | undefined;

const first = (raw: string | string[] | undefined) => (Array.isArray(raw) ? raw[0] : raw);

export function clientIp(headers: Headers, trustProxy = false): string {
  let value: string | undefined;
  if (trustProxy) {
    const forwarded = first(headers?.['x-forwarded-for']);
    value = forwarded?.split(',').pop()?.trim();
  } else {
    value = first(headers?.[PEER_ADDRESS_HEADER])?.trim();
  }
  return value && value.length > 0 ? value.slice(0, 45) : 'unknown';
}

const globalForPeer = globalThis as typeof globalThis & { __stancelinePeerHeader?: boolean };

/** Stamps each incoming request with the socket's remote address (Node runtime only; idempotent). */
export function installPeerAddressHeader(httpModule: { Server: { prototype: Server } }): void {
  if (globalForPeer.__stancelinePeerHeader) return;
  globalForPeer.__stancelinePeerHeader = true;
  const proto = httpModule.Server.prototype as Server & { emit: (event: string, ...args: unknown[]) => boolean };
  const emit = proto.emit;
  proto.emit = function patchedEmit(this: Server, event: string, ...args: unknown[]) {
    if (event === 'request') {
      const req = args[0] as IncomingMessage;
      req.headers[PEER_ADDRESS_HEADER] = req.socket?.remoteAddress ?? 'unknown';
    }
    return emit.call(this, event, ...args);
  };
}
