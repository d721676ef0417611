// Writes one recording's analysis in a single transaction: swings, their events (auto), values at the events,
// phase metrics, the display series, the parameters and the algorithm version. The automatic results of an
// earlier run are replaced; manual event corrections are carried over to the swing that now covers them and
// flagged `misfit` when they fall outside that swing or out of event order. A corrected swing that the new run no
// longer finds is kept, marked `stale`, so no manual work is lost silently.
import type { Knex } from 'knex';
import { EVENT_NAMES, type AnalysisOutput, type EventName, type SwingResult } from '@/lib/signal';
import { displaySeries } from './display-series';

const finiteOrNull = (v: number) => (Number.isFinite(v) ? v : null);

type ManualEvent = { swing_id: number; name: EventName; time_s: number };
type OldSwing = { id: number; start_s: number; end_s: number; impact_source: 'marker' | 'detected'; tempo_ratio: number | null };

/** Events of one swing must keep the order address < top < transition < impact < finish. */
function misfits(times: Record<EventName, number>, start: number, end: number): Set<EventName> {
  const bad = new Set<EventName>();
  EVENT_NAMES.forEach((name, k) => {
    const t = times[name];
    if (t < start || t > end) bad.add(name);
    if (k > 0 && !(t > times[EVENT_NAMES[k - 1]])) bad.add(name);
  });
  return bad;
}

export async function writeResults(trx: Knex.Transaction, recordingId: number, out: AnalysisOutput): Promise<void> {
  const oldSwings: OldSwing[] = await trx('swings').where({ recording_id: recordingId, stale: false }).select('id', 'start_s', 'end_s', 'impact_source', 'tempo_ratio');
  const manual: ManualEvent[] = oldSwings.length
    ? await trx('swing_events').whereIn('swing_id', oldSwings.map((s) => s.id)).andWhere({ source: 'manual' }).select('swing_id', 'name', 'time_s')
    : [];
  const oldAuto = manual.length
    ? await trx('swing_events').whereIn('swing_id', [...new Set(manual.map((m) => m.swing_id))]).select('swing_id', 'name', 'time_s', 'auto_time_s', 'source')
    : [];
  await trx('swings').where({ recording_id: recordingId }).andWhere({ stale: false }).delete();
  await trx('recording_series').where({ recording_id: recordingId }).delete();

  const swings = out.result.swings;
  const ids: number[] = [];
  for (const s of swings) {
    const [id] = await trx('swings').insert({
      recording_id: recordingId,
      swing_index: s.index,
      start_s: s.start_s,
      end_s: s.end_s,
      impact_source: s.impact_source,
      tempo_ratio: finiteOrNull(s.tempo_ratio),
    });
    ids.push(Number(id));
  }

  // Manual corrections: which new swing covers each corrected old swing (by its impact time)?
  const manualBySwing = new Map<number, Map<EventName, number>>();
  for (const m of manual) {
    if (!manualBySwing.has(m.swing_id)) manualBySwing.set(m.swing_id, new Map());
    manualBySwing.get(m.swing_id)!.set(m.name, Number(m.time_s));
  }
  const carried = new Map<number, Map<EventName, number>>(); // new swing index (0-based) -> manual times
  const orphans: number[] = [];
  for (const [oldId, times] of manualBySwing) {
    const impact = times.get('impact') ?? Number(oldAuto.find((e) => e.swing_id === oldId && e.name === 'impact')?.time_s);
    const k = swings.findIndex((s) => impact >= s.start_s && impact <= s.end_s);
    if (k >= 0 && !carried.has(k)) carried.set(k, times);
    else orphans.push(oldId);
  }

  const events: Record<string, unknown>[] = [];
  const values: Record<string, unknown>[] = [];
  const phases: Record<string, unknown>[] = [];
  swings.forEach((s: SwingResult, k) => {
    const swingId = ids[k];
    const manualTimes = carried.get(k);
    const times = { ...s.events };
    if (manualTimes) for (const [name, t] of manualTimes) times[name] = t;
    const bad = manualTimes ? misfits(times, s.start_s, s.end_s) : new Set<EventName>();
    for (const name of EVENT_NAMES) {
      const isManual = manualTimes?.has(name) ?? false;
      events.push({
        swing_id: swingId,
        name,
        time_s: isManual ? manualTimes!.get(name) : s.events[name],
        source: isManual ? 'manual' : 'auto',
        auto_time_s: s.events[name],
        misfit: isManual && bad.has(name),
      });
      const at = s.at_events[name];
      values.push({
        swing_id: swingId,
        event: name,
        lead_pct: finiteOrNull(at.lead_pct),
        lead_heel_pct: finiteOrNull(at.lead_heel_pct),
        trail_heel_pct: finiteOrNull(at.trail_heel_pct),
        cop_x_mm: finiteOrNull(at.cop_x_mm),
        cop_y_mm: finiteOrNull(at.cop_y_mm),
      });
    }
    for (const p of s.phases) {
      phases.push({
        swing_id: swingId,
        phase: p.name,
        duration_s: finiteOrNull(p.duration_s),
        cop_path_mm: finiteOrNull(p.cop_path_mm),
        peak_cop_speed_mm_s: finiteOrNull(p.peak_cop_speed_mm_s),
        mean_lead_pct: finiteOrNull(p.mean_lead_pct),
      });
    }
  });

  // Corrected swings the new run did not find: kept as stale swings after the found ones, events as they were.
  let nextIndex = swings.length + 1;
  for (const oldId of orphans) {
    const old = oldSwings.find((s) => s.id === oldId)!;
    const [id] = await trx('swings').insert({
      recording_id: recordingId,
      swing_index: nextIndex++,
      start_s: old.start_s,
      end_s: old.end_s,
      impact_source: old.impact_source,
      tempo_ratio: old.tempo_ratio,
      stale: true,
    });
    for (const e of oldAuto.filter((row) => row.swing_id === oldId)) {
      events.push({ swing_id: Number(id), name: e.name, time_s: e.time_s, source: e.source, auto_time_s: e.auto_time_s, misfit: e.source === 'manual' });
    }
  }

  const chunked = async (table: string, rows: Record<string, unknown>[]) => {
    for (let i = 0; i < rows.length; i += 500) await trx(table).insert(rows.slice(i, i + 500));
  };
  await chunked('swing_events', events);
  await chunked('swing_event_values', values);
  await chunked('swing_phase_metrics', phases);

  const display = displaySeries(out.series);
  await trx('recording_series').insert({
    recording_id: recordingId,
    method: display.method,
    buckets: display.buckets,
    bucket_s: display.bucketS,
    data: JSON.stringify({ t: display.t, traces: display.traces }),
  });

  const { algorithm_version: algorithmVersion, ...parameters } = out.result.processing;
  await trx('recordings').where({ id: recordingId }).update({
    status: 'ready',
    error_message: null,
    error_line: null,
    error_column: null,
    parameters: JSON.stringify(parameters),
    algorithm_version: algorithmVersion,
    metadata: JSON.stringify({ ...out.result.recording, gaps: out.result.gaps }),
    processed_at: trx.raw('NOW(3)'),
  });
}
