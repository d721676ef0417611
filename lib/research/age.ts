// Ages and age bands for research exports. Pure: dates are 'YYYY-MM-DD' strings, no clock.
//
// - The adult age (default 18) decides who was a minor at the time of a session and so needs a guardian's consent as
//   well. 18 follows the UN Convention on the Rights of the Child, Article 1 ("every human being below the age of
//   eighteen years unless under the law applicable to the child, majority is attained earlier"). It is a local-rule
//   choice: RESEARCH_ADULT_AGE sets it (lib/env.ts). Defer to the rules that apply where the academy works (for
//   example the GDPR, Art. 8, lets member states set the age of digital consent between 13 and 16) and to the
//   ethics board of the study.
// - Bands are five years wide, the grouping the UN recommends for age tables (Provisional Guidelines on Standard
//   International Age Classifications, 1982; from memory), with two changes: a band never straddles the adult age
//   (so minors and adults never share a band) and everyone from 65 on is one band (top-coding, a usual disclosure
//   control; common practice).

export const DEFAULT_ADULT_AGE = 18;
export const TOP_BAND_FROM = 65;
export const BOTTOM_BAND_BELOW = 10;

/** Whole years between a date of birth and a day (the birthday counts on the day itself; 29 Feb -> 1 Mar). */
export function ageOn(dateOfBirth: string, day: string): number {
  const [by, bm, bd] = dateOfBirth.split('-').map(Number);
  const [y, m, d] = day.split('-').map(Number);
  if (![by, bm, bd, y, m, d].every(Number.isFinite)) throw new RangeError(`not a date: ${dateOfBirth} / ${day}`);
  let age = y - by;
  if (m < bm || (m === bm && d < bd)) age -= 1;
  return age;
}

/** Lower edges of the bands: <10, 10-14, 15-(adult-1), adult-19, 20-24, ... 60-64, 65+. */
export function bandEdges(adultAge = DEFAULT_ADULT_AGE): number[] {
  const edges = new Set<number>([BOTTOM_BAND_BELOW]);
  for (let a = BOTTOM_BAND_BELOW; a < TOP_BAND_FROM; a += 5) edges.add(a);
  edges.add(adultAge);
  edges.add(TOP_BAND_FROM);
  return [...edges].filter((e) => e >= BOTTOM_BAND_BELOW && e <= TOP_BAND_FROM).sort((a, b) => a - b);
}

/** The band of an age, e.g. '15-17', '18-19', '65+', '<10'; 'unknown' without a date of birth. */
export function ageBand(age: number | null, adultAge = DEFAULT_ADULT_AGE): string {
  if (age === null || !Number.isFinite(age)) return 'unknown';
  const edges = bandEdges(adultAge);
  if (age < edges[0]) return `<${edges[0]}`;
  for (let k = 0; k < edges.length - 1; k++) if (age < edges[k + 1]) return `${edges[k]}-${edges[k + 1] - 1}`;
  return `${edges[edges.length - 1]}+`;
}

/**
 * May a session of this player go into a research export? Their research consent, and for a session before the
 * adult age a guardian's consent too. Without a date of birth nobody can tell, so the guardian's consent is needed.
 */
export function sessionConsented(
  consent: { research: boolean; guardianConsent: boolean },
  dateOfBirth: string | null,
  sessionDate: string,
  adultAge = DEFAULT_ADULT_AGE,
): boolean {
  if (!consent.research) return false;
  if (consent.guardianConsent) return true;
  return dateOfBirth !== null && ageOn(dateOfBirth, sessionDate) >= adultAge;
}
