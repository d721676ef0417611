import { getEnv } from '@/lib/env';

// Cookie settings shared by next-auth (lib/auth/options.ts) and the page proxy (proxy.ts).
// Cookies are secure (and carry the __Secure- / __Host- prefixes) only when the app is served over https.
export function cookieSettings() {
  const secure = (getEnv().NEXTAUTH_URL ?? '').startsWith('https://');
  const prefix = secure ? '__Secure-' : '';
  return {
    secure,
    base: { httpOnly: true, sameSite: 'lax' as const, path: '/', secure },
    sessionTokenName: `${prefix}next-auth.session-token`,
    callbackUrlName: `${prefix}next-auth.callback-url`,
    csrfTokenName: `${secure ? '__Host-' : ''}next-auth.csrf-token`,
  };
}
