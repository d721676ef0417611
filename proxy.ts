import { getToken } from 'next-auth/jwt';
import { NextResponse, type NextRequest } from 'next/server';
import { cookieSettings } from '@/lib/auth/cookies';
import { newNonce, pageCsp } from '@/lib/auth/csp';
import { getEnv } from '@/lib/env';

// Every page request: a fresh CSP nonce (lib/auth/csp.ts), set on the request so Next puts it on its scripts, and on
// the response. Then the page guard: a visitor without a valid session token is sent to the sign-in page. Roles are
// checked again on the server by every page (requirePageRole) and by every route handler (requireRole); /api is not
// matched here, so API calls get 401/403 JSON instead of a redirect.
// /invite/<token> and /reset-password[/<token>] are reached from a mail, before the person can sign in.
const PUBLIC_PAGES = /^\/(sign-in|sign-out|invite|reset-password)(\/|$)/;

export async function proxy(request: NextRequest) {
  const cookies = cookieSettings();
  const nonce = newNonce();
  const csp = pageCsp(nonce, { dev: process.env.NODE_ENV === 'development', https: cookies.secure });

  if (!PUBLIC_PAGES.test(request.nextUrl.pathname)) {
    const token = await getToken({
      req: request,
      secret: getEnv().NEXTAUTH_SECRET,
      cookieName: cookies.sessionTokenName,
      secureCookie: cookies.secure,
    });
    if (!token) {
      const signIn = new URL('/sign-in', request.url);
      const target = request.nextUrl.pathname + request.nextUrl.search;
      if (target !== '/') signIn.searchParams.set('callbackUrl', target);
      return NextResponse.redirect(signIn);
    }
  }

  const requestHeaders = new Headers(request.headers);
  requestHeaders.set('x-nonce', nonce);
  requestHeaders.set('Content-Security-Policy', csp);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set('Content-Security-Policy', csp);
  return response;
}

export const config = {
  matcher: ['/((?!api|_next/static|_next/image|favicon.ico|icon.svg|robots.txt).*)'],
};
