import { requireRole } from '@/lib/auth/roles';
import { getMailPreferences, setMailPreferences } from '@/lib/accounts/drill-mail';
import { json, readJson, withErrors } from '@/lib/http';
import { updateMailPreferencesSchema } from '@/lib/contracts/mail-preferences';

export const dynamic = 'force-dynamic';

// A student's own mail choices: drill reminders on or off.
export const GET = withErrors(async () => {
  const viewer = await requireRole('student');
  return json({ preferences: await getMailPreferences(viewer) });
});

export const PATCH = withErrors(async (request: Request) => {
  const viewer = await requireRole('student');
  const input = updateMailPreferencesSchema.parse(await readJson(request));
  return json({ preferences: await setMailPreferences(viewer, input) });
});
