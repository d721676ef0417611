// Row types of the database tables, from db/migrations; types/knex-tables.d.ts registers them with knex
// (knex/types/tables), so `db('targets')` is typed: a query reads numbers as numbers (no Number() casts) and a typo in
// a column name is a compile error. A migration that adds or changes a column updates its row here in the same commit.
// What mysql2 hands back (lib/db/connection.ts): INT, SMALLINT, BIGINT and DOUBLE as numbers; BOOLEAN (TINYINT(1)) as
// true/false; DATE as 'YYYY-MM-DD'; DATETIME as Date; JSON and LONGTEXT as strings (parse with lib/db/values.ts).
// Aliased tables ('swings as s') and raw queries stay untyped: knex types only plain table names.

type Id = number;
type DateOnly = string;
type JsonText = string;

export interface TargetRow {
  id: Id;
  academy_id: Id;
  owner_user_id: Id | null;
  athlete_id: Id | null;
  name: string;
  description: string;
  club_group: 'driver' | 'woods-hybrids' | 'irons' | 'wedges';
  is_default: boolean;
  common_practice: boolean;
  checks: JsonText;
  tempo_min: number | null;
  tempo_max: number | null;
  created_at: Date;
  updated_at: Date;
}
export interface BandRow {
  id: Id;
  academy_id: Id;
  owner_user_id: Id;
  name: string;
  swing_ids: JsonText;
  parameters: JsonText;
  k: number;
  shared: boolean;
  data: JsonText;
  created_at: Date;
  /** set while in the bin (DELETE); restore clears it */
  binned_at: Date | null;
}
export interface DrillRow {
  id: Id;
  academy_id: Id;
  owner_user_id: Id;
  name: string;
  steps: JsonText;
  addresses_checks: JsonText;
  cautions: string;
  created_at: Date;
  updated_at: Date;
  /** set while in the bin (DELETE); restore clears it */
  binned_at: Date | null;
}
export interface DrillAssignmentRow {
  id: Id;
  drill_id: Id;
  athlete_id: Id;
  assigned_by: Id | null;
  assigned_at: DateOnly;
  due_date: DateOnly;
  practice_done: boolean;
  done_at: Date | null;
  student_note: string | null;
  /** set while in the bin (DELETE); restore clears it */
  binned_at: Date | null;
}
