'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';
import type { NavItem } from './nav-items';

export function AppNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    // One line at every width: on a narrow screen the links scroll sideways rather than pushing the page down.
    <nav aria-label="Main" className="flex min-w-0 items-center gap-1 overflow-x-auto">
      {items.map((item) => {
        const active = item.href === '/' ? pathname === '/' : pathname.startsWith(item.href);
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? 'page' : undefined}
            className={`shrink-0 whitespace-nowrap rounded-md px-2.5 py-1.5 text-sm font-medium ${
              active ? 'bg-surface-sunken text-ink' : 'text-ink-muted hover:bg-surface-sunken hover:text-ink'
            }`}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
