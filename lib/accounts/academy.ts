import 'server-only';
import { db } from '@/lib/db/client';

export async function academyName(academyId: number): Promise<string> {
  const row = await db('academies').where({ id: academyId }).first('name');
  return row?.name ?? 'Your academy';
}
