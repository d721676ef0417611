import type { NextConfig } from 'next';
import { API_CSP } from './lib/auth/csp';

// Content-Security-Policy: pages get theirs from proxy.ts, with a fresh nonce per request (lib/auth/csp.ts says what
// stays inline and why); API answers get a policy that allows nothing. The other headers apply everywhere.
const securityHeaders = [
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  {
    key: 'Permissions-Policy',
    value: 'camera=(), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()',
  },
];

const nextConfig: NextConfig = {
  poweredByHeader: false,
  reactStrictMode: true,
  // gzip for every response the client accepts it for, route handlers included (GET /api/swings/:id relies on it)
  compress: true,
  // knex loads database drivers with dynamic require(); bundling it breaks that, so keep it external. piscina
  // starts its own worker script from its package folder, which only works unbundled.
  serverExternalPackages: ['knex', 'mysql2', 'bcryptjs', 'piscina'],
  async headers() {
    return [
      { source: '/:path*', headers: securityHeaders },
      { source: '/api/:path*', headers: [{ key: 'Content-Security-Policy', value: API_CSP }] },
    ];
  },
};

export default nextConfig;
