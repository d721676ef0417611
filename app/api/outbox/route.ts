import { requireRole } from '@/lib/auth/roles';
import { getEnv } from '@/lib/env';
import { json, NotFoundError, withErrors } from '@/lib/http';
import { listOutbox } from '@/lib/mail/outbox';

export const dynamic = 'force-dynamic';

// GET (admin, demo mode only): the mails the local SMTP fake kept, newest first. Outside demo mode: 404.
export const GET = withErrors(async () => {
  await requireRole('admin');
  if (getEnv().DEMO_MODE !== 'true') throw new NotFoundError('The outbox exists in demo mode only.');
  return json({ messages: await listOutbox() });
});
