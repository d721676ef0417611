import 'server-only';
import type { NextAuthOptions } from 'next-auth';
import CredentialsProvider from 'next-auth/providers/credentials';
import { clientIp } from '@/lib/auth/client-ip';
import { cookieSettings } from '@/lib/auth/cookies';
import { verifyPassword } from '@/lib/auth/password';
import { decideThrottle, SIGN_IN_WINDOW_MS } from '@/lib/auth/rate-limit';
import { rateLimitedCode, SERVICE_UNAVAILABLE } from '@/lib/auth/sign-in-errors';
import { markLoginSucceeded, reserveLoginAttempt } from '@/lib/db/login-attempts';
import { bumpSessionVersion, findUserForSignIn } from '@/lib/db/users';
import { getEnv } from '@/lib/env';
import { signInSchema } from '@/lib/contracts/users';

const SESSION_MAX_AGE_S = 8 * 60 * 60; // one working day


/** Codes the sign-in page knows; next-auth copies a thrown error's message into the redirect's ?error=. */
const KNOWN_CODE = /^(invalid-input|rate-limited-(email|ip)-\d+)$/;

/**
 * authorize() for next-auth: a coded Error for bad input or a throttle, null for wrong credentials. Any other failure
 * (the database is down: "connect ECONNREFUSED 127.0.0.1:3311") is logged here and becomes "service-unavailable",
 * so no internal detail reaches the redirect URL.
 */
export async function authorizeCredentials(raw: unknown, ip: string, now = new Date()) {
  try {
    return await checkCredentials(raw, ip, now);
  } catch (error) {
    if (error instanceof Error && KNOWN_CODE.test(error.message)) throw error;
    console.error('[stanceline] sign-in could not be checked', error);
    throw new Error(SERVICE_UNAVAILABLE);
  }
}

/** Checks the throttle, then the password; records the outcome. Throws a coded Error when throttled. */
async function checkCredentials(raw: unknown, ip: string, now: Date) {
  const parsed = signInSchema.safeParse(raw);
  if (!parsed.success) throw new Error('invalid-input');
  const { email, password } = parsed.data;

  const since = new Date(now.getTime() - SIGN_IN_WINDOW_MS);
  const { decision, attemptId } = await reserveLoginAttempt({ email, ip, at: now }, since, (emailFailures, ipFailures) =>
    decideThrottle(emailFailures, ipFailures, now),
  );
  if (!decision.allowed) throw new Error(rateLimitedCode(decision.scope, decision.retryAfterMinutes));

  // The attempt is already recorded as a failure; only a success changes it.
  const user = await findUserForSignIn(email);
  const passwordMatches = await verifyPassword(password, user?.passwordHash ?? null);
  const succeeded = Boolean(user && user.active && passwordMatches);
  if (succeeded && attemptId !== null) await markLoginSucceeded(attemptId);
  if (!user || !succeeded) return null;
  return { id: String(user.id), email: user.email, name: user.name, role: user.role, academyId: user.academyId, sessionVersion: user.sessionVersion };
}

let cached: NextAuthOptions | undefined;

/** Built on first use (not at import) so `next build` does not need the runtime environment. */
export function getAuthOptions(): NextAuthOptions {
  cached ??= buildAuthOptions();
  return cached;
}

function buildAuthOptions(): NextAuthOptions {
  const env = getEnv();
  const cookies = cookieSettings();
  return {
    secret: env.NEXTAUTH_SECRET,
    session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_S },
    jwt: { maxAge: SESSION_MAX_AGE_S },
    useSecureCookies: cookies.secure,
    cookies: {
      sessionToken: { name: cookies.sessionTokenName, options: cookies.base },
      callbackUrl: { name: cookies.callbackUrlName, options: cookies.base },
      csrfToken: { name: cookies.csrfTokenName, options: cookies.base },
    },
    pages: { signIn: '/sign-in', signOut: '/sign-out', error: '/sign-in' },
    providers: [
      CredentialsProvider({
        name: 'Email and password',
        credentials: {
          email: { label: 'Email', type: 'email' },
          password: { label: 'Password', type: 'password' },
        },
        authorize: (credentials, req) => authorizeCredentials(credentials, clientIp(req?.headers, env.TRUST_PROXY === 'true')),
      }),
    ],
    events: {
      // Sign-out ends this token and every other copy of it: the next request with it finds an older version.
      async signOut({ token }) {
        if (token && typeof token.uid === 'number') await bumpSessionVersion(token.uid);
      },
    },
    callbacks: {
      jwt({ token, user }) {
        if (user) {
          token.uid = Number(user.id);
          token.role = user.role;
          token.academyId = user.academyId;
          token.sv = user.sessionVersion;
        }
        return token;
      },
      session({ session, token }) {
        session.user = {
          id: token.uid,
          role: token.role,
          academyId: token.academyId,
          sessionVersion: typeof token.sv === 'number' ? token.sv : -1,
          name: token.name ?? '',
          email: token.email ?? '',
        };
        return session;
      },
    },
  };
}
