import NextAuth from 'next-auth';
import { getAuthOptions } from '@/lib/auth/options';

export const dynamic = 'force-dynamic';

type Context = { params: Promise<{ nextauth: string[] }> };

// Options are read per request (built once) so that `next build` needs no runtime environment.
function handler(request: Request, context: Context) {
  return NextAuth(request as never, context as never, getAuthOptions());
}

export { handler as GET, handler as POST };
