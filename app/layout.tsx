import type { Metadata } from 'next';
import localFont from 'next/font/local';
import { connection } from 'next/server';
import { ZodJitless } from '@/components/shell/zod-jitless';
import type { ReactNode } from 'react';
import './globals.css';

// Inter (SIL Open Font License, see app/fonts/inter-LICENSE.txt), shipped with the app: no font CDN.
const inter = localFont({
  src: './fonts/inter-latin-wght-normal.woff2',
  variable: '--font-inter',
  weight: '100 900',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Stanceline', template: '%s · Stanceline' },
  description: 'Ground-pressure workbench for golf coaches and their students.',
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page is rendered per request: Next can put the request's CSP nonce (proxy.ts) only on scripts it renders
  // then; a page prerendered at build time would carry scripts without it, and the browser would block them.
  await connection();
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-screen font-sans">
        <ZodJitless />
        {children}
      </body>
    </html>
  );
}
