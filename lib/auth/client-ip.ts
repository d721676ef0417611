// The client address for per-IP throttling. `next start` fills x-forwarded-for with the socket address when
// the header is absent; behind a reverse proxy, the proxy must overwrite the header (not append to a client
// value), otherwise a client can choose its own address and only the per-email limit protects the account.
export function clientIp(headers: Record<string, string | string[] | undefined> | undefined): string {
  const raw = headers?.['x-forwarded-for'] ?? headers?.['x-real-ip'];
  const value = Array.isArray(raw) ? raw[0] : raw;
  const first = value?.split(',')[0]?.trim();
  return first && first.length > 0 ? first.slice(0, 45) : 'unknown';
}
