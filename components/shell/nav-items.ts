import type { Role } from '@/lib/contracts/users';

/** demoOnly: listed only in demo mode (DEMO_MODE=true) */
export type NavItem = { href: string; label: string; demoOnly?: true };

// What each role can open; pages check the role again on the server.
export const navItemsByRole: Record<Role, NavItem[]> = {
  coach: [
    { href: '/', label: 'Overview' },
    { href: '/roster', label: 'Roster' },
    { href: '/upload', label: 'Upload' },
    { href: '/live', label: 'Live' },
    { href: '/targets', label: 'Targets' },
    { href: '/bands', label: 'Bands' },
    { href: '/drills', label: 'Drills' },
    { href: '/invitations', label: 'Invitations' },
    { href: '/reviews', label: 'Reviews' },
  ],
  student: [
    { href: '/', label: 'My profile' },
    { href: '/drills', label: 'My drills' },
    { href: '/targets', label: 'My targets' },
    { href: '/reviews', label: 'Reviews' },
  ],
  admin: [
    { href: '/', label: 'Overview' },
    { href: '/users', label: 'Accounts' },
    { href: '/invitations', label: 'Invitations' },
    { href: '/reviews', label: 'Reviews' },
    { href: '/outbox', label: 'Outbox', demoOnly: true },
  ],
  researcher: [{ href: '/', label: 'Research' }],
};
