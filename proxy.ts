import { getToken } from 'next-auth/jwt';
import { NextResponse, type NextRequest } from 'next/server';
import { cookieSettings } from '@/lib/auth/cookies';
import { getEnv } from '@/lib/env';

// Page guard only: a visitor without a valid session token is sent to the sign-in page. Roles are checked
// again on the server by every page (requirePageRole) and by every route handler (requireRole); /api is not
// matched here, so API calls get 401/403 JSON instead of a redirect.
export async function proxy(request: NextRequest) {
  const cookies = cookieSettings();
  const token = await getToken({
    req: request,
    secret: getEnv().NEXTAUTH_SECRET,
    cookieName: cookies.sessionTokenName,
    secureCookie: cookies.secure,
  });
  if (token) return NextResponse.next();
  const signIn = new URL('/sign-in', request.url);
  const target = request.nextUrl.pathname + request.nextUrl.search;
  if (target !== '/') signIn.searchParams.set('callbackUrl', target);
  return NextResponse.redirect(signIn);
}

export const config = {
  matcher: ['/((?!api|_next/static|_next/image|sign-in|sign-out|favicon.ico|icon.svg|robots.txt).*)'],
};
