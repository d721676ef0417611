import type { Role } from '@/lib/validations/user';

// The session and JWT carry the user id, role and academy id (set in lib/auth/options.ts callbacks).
declare module 'next-auth' {
  interface Session {
    user: { id: number; role: Role; academyId: number; name: string; email: string; sessionVersion: number };
  }
  interface User {
    role: Role;
    academyId: number;
    sessionVersion: number;
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid: number;
    role: Role;
    academyId: number;
    /** users.session_version when the token was issued; an older one is refused (lib/auth/roles.ts getViewer) */
    sv: number;
  }
}
