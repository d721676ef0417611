import type { Role } from '@/lib/validations/user';

// The session and JWT carry the user id, role and academy id (set in lib/auth/options.ts callbacks).
declare module 'next-auth' {
  interface Session {
    user: { id: number; role: Role; academyId: number; name: string; email: string };
  }
  interface User {
    role: Role;
    academyId: number;
  }
}

declare module 'next-auth/jwt' {
  interface JWT {
    uid: number;
    role: Role;
    academyId: number;
  }
}
