import { describe, expect, it } from 'vitest';
import { annotationTime, sortAnnotations } from '@/components/swings/annotations-panel';
import { labelFormSchema, splitTags, toFormValues, toLabels } from '@/components/swings/label-form-schema';
import type { Annotation } from '@/lib/contracts/swings';
import { eventRecord, movedEvents, sensorFrames, timeAxis, traceSeries } from '@/components/swings/swing-view-model';

// The swing page's translations between the API's JSON and the viewer. Expected values are worked out by hand from
// the inputs written here (no outside reference needed: these are format conversions, not computation).

const ev = (name: 'address' | 'top' | 'transition' | 'impact' | 'finish', timeS: number, autoTimeS: number | null = null) => ({
  name,
  timeS,
  source: autoTimeS === null ? ('auto' as const) : ('manual' as const),
  autoTimeS,
  misfit: false,
  leadPct: null,
  leadHeelPct: null,
  trailHeelPct: null,
  copXMm: null,
  copYMm: null,
});
const events = [ev('address', 1), ev('top', 1.8, 1.75), ev('transition', 1.9), ev('impact', 2.1), ev('finish', 2.7)];

describe('swing view model', () => {
  it('turns JSON nulls into NaN gaps and keeps the time axis', () => {
    const s = traceSeries({ time: { start: 0, step: 0.01, count: 2 }, leadPct: [50, null], leadHeelPct: [1, 2], trailHeelPct: [3, 4], copX: [5, 6], copY: [7, 8], copSpeed: [null, 9] });
    expect(Array.from(s.time)).toEqual([0, 0.01]);
    expect(s.leadPct[0]).toBe(50);
    expect(Number.isNaN(s.leadPct[1])).toBe(true);
    expect(Number.isNaN(s.copSpeed[0])).toBe(true);
  });

  it('expands the columnar time axis (first time + step) to one time per sample, to 0.1 ms', () => {
    // 200 Hz from 12.345 s: sample i at 12.345 + i * 0.005 s; 0.1 * 3 = 0.30000000000000004 in doubles, rounded away
    expect(Array.from(timeAxis({ start: 12.345, step: 0.005, count: 4 }))).toEqual([12.345, 12.35, 12.355, 12.36]);
    expect(Array.from(timeAxis({ start: 0, step: 0.1, count: 4 }))).toEqual([0, 0.1, 0.2, 0.3]);
    expect(timeAxis({ start: 5, step: 0.01, count: 0 })).toHaveLength(0);
    expect(timeAxis({ start: 100.00995, step: 0.01, count: 3 })[2]).toBe(100.03);
  });

  it('reads the saved and the automatic event times; a missing event gives null', () => {
    expect(eventRecord(events)).toEqual({ address: 1, top: 1.8, transition: 1.9, impact: 2.1, finish: 2.7 });
    expect(eventRecord(events, 'autoTimeS')).toEqual({ address: 1, top: 1.75, transition: 1.9, impact: 2.1, finish: 2.7 });
    expect(eventRecord(events.slice(0, 4))).toBeNull();
  });

  it('sends only the events that moved by more than the API’s 1 ms rounding, rounded to 1 ms', () => {
    const saved = { address: 1, top: 1.8, transition: 1.9, impact: 2.1, finish: 2.7 };
    expect(movedEvents(saved, { ...saved, top: 1.85000000001, impact: 2.1004 })).toEqual({ top: 1.85 });
    expect(movedEvents(saved, saved)).toEqual({});
  });

  it('turns per-event force snapshots into one column per sensor, in time order', () => {
    const f = sensorFrames([
      { timeS: 2.1, event: 'impact', forcesN: { L1: 30, R1: 70 } },
      { timeS: 1, event: 'address', forcesN: { L1: 50 } },
    ])!;
    expect(f.timeS).toEqual([1, 2.1]);
    expect(f.forcesN.L1).toEqual([50, 30]);
    expect(Number.isNaN((f.forcesN.R1 as number[])[0])).toBe(true);
    expect(f.forcesN.R1[1]).toBe(70);
    expect(sensorFrames([])).toBeNull();
  });
});

describe('notes in the swing’s time order', () => {
  const note = (id: number, timeS: number | null, phase: Annotation['phase']): Annotation => ({ id, authorName: 'A', authorRole: 'coach', body: `n${id}`, timeS, phase, visibility: 'shared', createdAt: '', updatedAt: '' });
  const saved = eventRecord(events);

  it('places a phase note at the start event of its phase', () => {
    expect(annotationTime(note(1, null, 'downswing'), saved)).toBe(1.9); // downswing runs transition -> impact
    expect(annotationTime(note(2, 2.5, null), saved)).toBe(2.5);
  });

  it('sorts time and phase notes together', () => {
    const list = [note(1, 2.5, null), note(2, null, 'backswing'), note(3, null, 'follow-through'), note(4, 1.85, null)];
    expect(sortAnnotations(list, saved).map((n) => n.id)).toEqual([2, 4, 3, 1]); // 1.0, 1.85, 2.1, 2.5
  });
});

describe('labels form', () => {
  it('round-trips the API labels through the form values', () => {
    const labels = { club: 'iron-7' as const, strike: 'thin' as const, flight: null, tags: ['windy', 'new grip'], rating: 4, notASwing: false };
    expect(toLabels(toFormValues(labels))).toEqual(labels);
  });

  it('splits, trims and de-duplicates tags', () => {
    expect(splitTags(' a, b ,,a , c')).toEqual(['a', 'b', 'c']);
  });

  it('refuses a tag longer than the route allows, on the tags field', () => {
    const r = labelFormSchema.safeParse({ club: '', strike: '', flight: '', tags: 'x'.repeat(41), rating: '', notASwing: false });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path).toEqual(['tags']);
  });
});
