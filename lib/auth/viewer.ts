import type { Role } from '@/lib/contracts/users';

/** The signed-in user as the server sees it (from the JWT session): who asks, with what role, in which academy. */
export type Viewer = {
  id: number;
  role: Role;
  academyId: number;
  name: string;
  email: string;
};
