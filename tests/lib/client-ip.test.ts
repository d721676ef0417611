import { describe, expect, it } from 'vitest';
import { clientIp, PEER_ADDRESS_HEADER } from '@/lib/auth/client-ip';

describe('clientIp', () => {
  const headers = { 'x-forwarded-for': '198.51.100.9, 203.0.113.5', [PEER_ADDRESS_HEADER]: '127.0.0.1' };

  it('without TRUST_PROXY ignores X-Forwarded-For (the client writes it) and uses the connection address', () => {
    expect(clientIp(headers, false)).toBe('127.0.0.1');
    expect(clientIp({ 'x-forwarded-for': '198.51.100.9' }, false)).toBe('unknown');
  });

  it('with TRUST_PROXY takes the last X-Forwarded-For entry, the address the proxy saw', () => {
    expect(clientIp(headers, true)).toBe('203.0.113.5');
    expect(clientIp({ 'x-forwarded-for': '203.0.113.5' }, true)).toBe('203.0.113.5');
    expect(clientIp({}, true)).toBe('unknown');
  });
});
