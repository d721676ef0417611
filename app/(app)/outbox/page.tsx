import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { Card, PageHeader } from '@/components/ui/card';
import { requirePageRole } from '@/lib/auth/roles';
import { getEnv } from '@/lib/env';
import { listOutbox } from '@/lib/mail/outbox';

export const metadata: Metadata = { title: 'Outbox' };

// Demo mode only: the mails the local SMTP fake received, so a demo can follow an invitation or a reset link.
export default async function OutboxPage() {
  await requirePageRole('admin');
  if (getEnv().DEMO_MODE !== 'true') notFound();
  const messages = await listOutbox();
  return (
    <>
      <PageHeader title="Outbox" subtitle="Demo mode: mails the app sent, as the local mail server received them. Nothing here left this machine." />
      <Card>
        {messages.length === 0 ? (
          <p className="text-sm text-ink-muted">No mail sent yet.</p>
        ) : (
          <ul className="divide-y divide-surface-line" data-testid="outbox">
            {messages.map((m) => (
              <li key={m.id} className="py-3 text-sm">
                <details>
                  <summary className="flex min-h-11 cursor-pointer flex-wrap items-center gap-x-3">
                    <span className="font-medium">{m.subject}</span>
                    <span className="text-ink-muted">to {m.to}</span>
                    <time className="text-ink-muted" dateTime={m.receivedAt}>
                      {m.receivedAt.replace('T', ' ').slice(0, 16)} UTC
                    </time>
                  </summary>
                  <pre className="mt-2 whitespace-pre-wrap rounded-md bg-surface-sunken p-3 font-sans text-sm">{m.text}</pre>
                  <p className="mt-2 text-ink-muted">{m.hasHtml ? 'Also has an HTML part.' : 'Text part only.'}</p>
                  {m.links.length > 0 && (
                    <ul className="mt-1">
                      {m.links.map((href) => (
                        <li key={href}>
                          <a href={href} className="inline-flex min-h-11 items-center break-all text-accent underline">
                            {href}
                          </a>
                        </li>
                      ))}
                    </ul>
                  )}
                </details>
              </li>
            ))}
          </ul>
        )}
      </Card>
    </>
  );
}
