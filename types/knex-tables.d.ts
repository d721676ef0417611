// Registers the row types of lib/db/tables.ts with knex through its knex/types/tables interface, so db('targets') is typed.
import 'knex';
import type { BandRow, DrillAssignmentRow, DrillRow, TargetRow } from '@/lib/db/tables';

declare module 'knex/types/tables' {
  // Typed so far: the tables of targets, bands and drills. The others follow as their modules move to these rows.
  interface Tables {
    targets: TargetRow;
    bands: BandRow;
    drills: DrillRow;
    drill_assignments: DrillAssignmentRow;
  }
}
