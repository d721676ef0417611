// Writes one recording's analysis in a single transaction: swings, their events (auto), values at the events,
// phase metrics, each swing's full-rate window (swing_series), the display series, the parameters and the
// algorithm version. The per-sample work (windows, display series, the viewer's per-swing parts as JSON text) was
// done where the analysis ran (lib/jobs/prepare-results.ts), so this runs on the server's event loop without
// holding it up: it assembles text and sends statements. The automatic results of an earlier run are replaced; the coach's work is carried over to the
// swing that now covers it (by impact time): manual event corrections (flagged `misfit` when they fall outside
// that swing or out of event order), labels, "not a swing" (hidden), annotations and the correction audit. A swing
// with such work that the new run no longer finds is kept, marked `stale`, with its old numbers and window, so no
// manual work is lost silently.
import type { Knex } from 'knex';
import { EVENT_NAMES, type EventName, type SwingResult } from '@/lib/signal';
import { insertInBatches } from '@/lib/db/batch';
import { recomputeSwing } from '@/lib/swings/recompute';
import { storeRecordingPayloads } from '@/lib/swings/payload-build';
import { parseStoredSeries } from '@/lib/swings/stored-series';
import type { PreparedAnalysis } from './prepare-results';

const finiteOrNull = (v: number) => (Number.isFinite(v) ? v : null);

type OldEvent = { swing_id: number; name: EventName; time_s: number; auto_time_s: number | null; source: 'auto' | 'manual'; misfit: boolean };
type OldSwing = { id: number; start_s: number; end_s: number; impact_source: 'marker' | 'detected'; tempo_ratio: number | null; hidden: boolean };
type Row = Record<string, unknown>;

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

const valueRow = (swingId: number, name: EventName, at: SwingResult['at_events'][EventName]) => ({
  swing_id: swingId,
  event: name,
  lead_pct: finiteOrNull(at.lead_pct),
  lead_heel_pct: finiteOrNull(at.lead_heel_pct),
  trail_heel_pct: finiteOrNull(at.trail_heel_pct),
  cop_x_mm: finiteOrNull(at.cop_x_mm),
  cop_y_mm: finiteOrNull(at.cop_y_mm),
});

const phaseRow = (swingId: number, p: SwingResult['phases'][number]) => ({
  swing_id: swingId,
  phase: p.name,
  duration_s: finiteOrNull(p.duration_s),
  cop_path_mm: finiteOrNull(p.cop_path_mm),
  peak_cop_speed_mm_s: finiteOrNull(p.peak_cop_speed_mm_s),
  mean_lead_pct: finiteOrNull(p.mean_lead_pct),
});

export async function writeResults(trx: Knex.Transaction, recordingId: number, out: PreparedAnalysis): Promise<void> {
  const swings = out.result.swings;
  const oldSwings: OldSwing[] = await trx('swings').where({ recording_id: recordingId, stale: false }).select('id', 'start_s', 'end_s', 'impact_source', 'tempo_ratio', 'hidden');
  const oldIds = oldSwings.map((s) => s.id);
  const some = (table: string, columns: string[]) => (oldIds.length ? trx(table).whereIn('swing_id', oldIds).select(columns) : Promise.resolve([]));
  const manual: OldEvent[] = oldIds.length ? await trx('swing_events').whereIn('swing_id', oldIds).andWhere({ source: 'manual' }).select('swing_id', 'name', 'time_s') : [];
  const labels: Row[] = await some('swing_labels', ['*']);
  const notes: Row[] = await some('swing_annotations', ['*']);
  const audit: Row[] = await some('swing_event_corrections', ['*']);

  // Swings carrying the coach's work, and where each one goes: the new swing covering its (current) impact time.
  const worked = new Set<number>([...manual.map((m) => m.swing_id), ...labels.map((l) => Number(l.swing_id)), ...notes.map((a) => Number(a.swing_id))]);
  for (const s of oldSwings) if (s.hidden) worked.add(s.id);
  const oldEvents: OldEvent[] = worked.size ? await trx('swing_events').whereIn('swing_id', [...worked]).select('swing_id', 'name', 'time_s', 'auto_time_s', 'source', 'misfit') : [];
  const target = new Map<number, number>(); // old swing id -> new swing index (0-based)
  const taken = new Set<number>();
  const orphans: number[] = [];
  for (const oldId of [...worked].sort((a, b) => a - b)) {
    const impact = Number(oldEvents.find((e) => e.swing_id === oldId && e.name === 'impact')?.time_s);
    const k = swings.findIndex((s) => impact >= s.start_s && impact <= s.end_s);
    if (k >= 0 && !taken.has(k)) {
      target.set(oldId, k);
      taken.add(k);
    } else orphans.push(oldId);
  }
  // What stale swings keep: their old numbers and window.
  const orphanRows = async (table: string) => (orphans.length ? trx(table).whereIn('swing_id', orphans).select('*') : []);
  const [orphanValues, orphanPhases, orphanSeries] = await Promise.all([orphanRows('swing_event_values'), orphanRows('swing_phase_metrics'), orphanRows('swing_series')]);

  await trx('swings').where({ recording_id: recordingId }).andWhere({ stale: false }).delete();
  await trx('recording_series').where({ recording_id: recordingId }).delete();

  // one statement for all found swings, then their ids by number (few round trips: on a busy server every
  // await of this transaction waits behind the requests being served)
  await insertInBatches(
    trx,
    'swings',
    swings.map((s) => ({
      recording_id: recordingId,
      swing_index: s.index,
      start_s: s.start_s,
      end_s: s.end_s,
      impact_source: s.impact_source,
      tempo_ratio: finiteOrNull(s.tempo_ratio),
      partial: s.partial,
      forward_press_s: s.forward_press ? s.forward_press.time_s : null,
      forward_press_mm: s.forward_press ? finiteOrNull(s.forward_press.size_mm) : null,
      promoted: s.promoted ?? null,
    })),
  );
  const idByIndex = new Map<number, number>();
  if (swings.length > 0) {
    for (const r of await trx('swings').where({ recording_id: recordingId, stale: false }).select('id', 'swing_index')) idByIndex.set(Number(r.swing_index), Number(r.id));
  }
  const ids = swings.map((s) => idByIndex.get(s.index)!);

  const manualByOld = new Map<number, Map<EventName, number>>();
  for (const m of manual) {
    if (!manualByOld.has(m.swing_id)) manualByOld.set(m.swing_id, new Map());
    manualByOld.get(m.swing_id)!.set(m.name, Number(m.time_s));
  }
  const carried = new Map<number, Map<EventName, number>>(); // new swing index -> manual times
  for (const [oldId, k] of target) if (manualByOld.has(oldId)) carried.set(k, manualByOld.get(oldId)!);

  const events: Row[] = [];
  const values: Row[] = [];
  const phases: Row[] = [];
  const windows: Row[] = [];
  // swing id -> the viewer's per-swing parts the thread made at the automatic events; a swing with carried
  // corrections gets its parts built from the stored rows instead (storeRecordingPayloads)
  const parts = new Map<number, { seriesJson: string; framesJson: string }>();
  for (const [k, s] of swings.entries()) {
    const swingId = ids[k];
    const window = out.windows[k];
    windows.push({ swing_id: swingId, sample_rate_hz: window.sampleRateHz, samples: window.samples, data: window.data });

    const manualTimes = carried.get(k);
    if (!manualTimes) parts.set(swingId, window);
    const times = { ...s.events };
    if (manualTimes) for (const [name, time] of manualTimes) times[name] = time;
    const bad = manualTimes ? misfits(times, s.start_s, s.end_s) : new Set<EventName>();
    // Carried corrections that still fit are re-valued on the new window; misfits keep the automatic numbers
    // (nothing sensible can be measured between disordered events) until the coach moves them again.
    let numbers: Pick<SwingResult, 'at_events' | 'phases' | 'tempo_ratio'> = s;
    if (manualTimes && bad.size === 0) {
      try {
        const r = recomputeSwing(parseStoredSeries(window.data), times);
        numbers = { at_events: r.atEvents, phases: r.phases, tempo_ratio: r.tempoRatio };
      } catch (error) {
        if (!(error instanceof RangeError)) throw error;
        for (const name of manualTimes.keys()) bad.add(name); // two corrections on one sample at the new rate
      }
    }
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
      values.push(valueRow(swingId, name, numbers.at_events[name]));
    }
    for (const p of numbers.phases) phases.push(phaseRow(swingId, p));
    if (numbers !== s) await trx('swings').where({ id: swingId }).update({ tempo_ratio: finiteOrNull(numbers.tempo_ratio) });
  }

  // Swings with the coach's work that the new run did not find: kept as stale swings after the found ones.
  const newId = new Map<number, number>(); // old swing id -> new swing id
  for (const [oldId, k] of target) newId.set(oldId, ids[k]);
  let nextIndex = swings.length + 1;
  for (const oldId of orphans) {
    const old = oldSwings.find((s) => s.id === oldId)!;
    const [inserted] = await trx('swings').insert({
      recording_id: recordingId,
      swing_index: nextIndex++,
      start_s: old.start_s,
      end_s: old.end_s,
      impact_source: old.impact_source,
      tempo_ratio: old.tempo_ratio,
      stale: true,
    });
    const id = Number(inserted);
    newId.set(oldId, id);
    for (const e of oldEvents.filter((row) => row.swing_id === oldId)) {
      events.push({ swing_id: id, name: e.name, time_s: e.time_s, source: e.source, auto_time_s: e.auto_time_s, misfit: e.source === 'manual' });
    }
    for (const v of orphanValues.filter((row) => row.swing_id === oldId)) values.push({ ...v, swing_id: id });
    for (const p of orphanPhases.filter((row) => row.swing_id === oldId)) {
      const { id: _rowId, ...rest } = p;
      phases.push({ ...rest, swing_id: id });
    }
    for (const w of orphanSeries.filter((row) => row.swing_id === oldId)) windows.push({ ...w, swing_id: id });
  }
  for (const old of oldSwings) if (old.hidden && newId.has(old.id)) await trx('swings').where({ id: newId.get(old.id) }).update({ hidden: true });

  const chunked = (table: string, rows: Row[]) => insertInBatches(trx, table, rows);
  const moved = (rows: Row[]) => rows.filter((r) => newId.has(Number(r.swing_id))).map((r) => ({ ...r, swing_id: newId.get(Number(r.swing_id)) }));
  await chunked('swing_events', events);
  await chunked('swing_event_values', values.map(({ id: _id, ...rest }) => rest));
  await chunked('swing_phase_metrics', phases);
  await chunked('swing_series', windows);
  await chunked('swing_labels', moved(labels));
  await chunked('swing_annotations', moved(notes)); // same ids, so links to a note survive a reprocess
  await chunked('swing_event_corrections', moved(audit));

  const display = out.display;
  await trx('recording_series').insert({ recording_id: recordingId, method: display.method, buckets: display.buckets, bucket_s: display.bucketS, data: display.data });

  // the candidates the finder rejected (not the ones inside a found swing): the coach may promote one
  await trx('recording_candidates').where({ recording_id: recordingId }).delete();
  await chunked('recording_candidates', out.rejected.map((c) => ({ recording_id: recordingId, time_s: c.timeS, reason: c.reason })));

  // the processing block exactly as `npm run analyze` prints it; where the golfer's parameters came from (form, file,
  // profile, default) goes with the recording's metadata
  const { algorithm_version: algorithmVersion, ...parameters } = out.result.processing;
  await trx('recordings').where({ id: recordingId }).update({
    status: 'ready',
    error_message: null,
    error_line: null,
    error_column: null,
    parameters: JSON.stringify(parameters),
    algorithm_version: algorithmVersion,
    metadata: JSON.stringify({ ...out.result.recording, gaps: out.result.gaps, parameter_sources: out.parameters }),
    processed_at: trx.raw('NOW(3)'),
  });
  await storeRecordingPayloads(trx, recordingId, parts); // after the recording's parameters and overview
}
