// `npm run db:seed`: resets every table to the invented demo scenario (see db/demo/scenario.ts).
import type { Knex } from 'knex';
import { seedDemo } from '../demo/seed-demo';

export async function seed(knex: Knex): Promise<void> {
  await seedDemo(knex);
}
