import { inject } from 'vitest';
import { seedDemo } from '@/db/demo/seed-demo';

/** Points the app's client at the integration database and resets it to the demo scenario. */
export async function resetToDemo(): Promise<void> {
  process.env.DATABASE_URL ||= inject('databaseUrl');
  const { db } = await import('@/lib/db/client');
  await seedDemo(db);
}
