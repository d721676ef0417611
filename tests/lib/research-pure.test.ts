import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { ageBand, ageOn, bandEdges, sessionConsented } from '@/lib/research/age';
import { isoWeek, isoWeekMonday } from '@/lib/research/iso-week';
import { playerCode } from '@/lib/research/player-code';
import { codebook, columnsOf, longRows, ROWS_PER_SWING_LONG, roundTo, wideRow, type ExportSwing } from '@/lib/research/phase-table';

// The pure parts of research exports, checked against outside references: Python's standard library (Debian's
// /usr/bin/python3: datetime.date.isocalendar for ISO 8601 weeks, hmac for RFC 2104 HMAC-SHA256) and worked examples
// of the ISO week date.

function python(script: string): string {
  const r = spawnSync('/usr/bin/python3', ['-c', script], { encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`python3 failed: ${r.stderr}`);
  return r.stdout;
}

describe('ISO 8601 weeks', () => {
  it('match worked examples at the year ends (ISO 8601 week date; examples from memory of the standard’s rules)', () => {
    // 29 Dec 2008 is a Monday in the week of Thursday 1 Jan 2009 -> 2009-W01; 3 Jan 2010 is a Sunday of the week of
    // Thursday 31 Dec 2009 -> 2009-W53; 1 Jan 2005 is a Saturday in the week of Thursday 30 Dec 2004 -> 2004-W53.
    expect(isoWeek('2008-12-29')).toBe('2009-W01');
    expect(isoWeek('2010-01-03')).toBe('2009-W53');
    expect(isoWeek('2005-01-01')).toBe('2004-W53');
    expect(isoWeekMonday('2009-W01')).toBe('2008-12-29');
  });

  it('agree with Python’s datetime.date.isocalendar on every day of 1999-2032', () => {
    const out = python(
      'import datetime\nd=datetime.date(1999,1,1)\nwhile d<=datetime.date(2032,12,31):\n  y,w,_=d.isocalendar()\n  print(d.isoformat(), "%d-W%02d"%(y,w))\n  d+=datetime.timedelta(days=1)',
    );
    const lines = out.trim().split('\n');
    expect(lines.length).toBe(12419);
    let mismatches = 0;
    for (const line of lines) {
      const [day, week] = line.split(' ');
      if (isoWeek(day) !== week) mismatches += 1;
      if (day.endsWith('-06-15') && isoWeekMonday(week) > day) mismatches += 1;
    }
    expect(mismatches).toBe(0);
  });
});

describe('ages and bands', () => {
  it('counts whole years, the birthday counting on the day itself', () => {
    expect(ageOn('2008-03-12', '2026-03-11')).toBe(17);
    expect(ageOn('2008-03-12', '2026-03-12')).toBe(18);
    expect(ageOn('2008-02-29', '2026-02-28')).toBe(17); // a 29 February birthday falls on 1 March in common years
    expect(ageOn('2008-02-29', '2026-03-01')).toBe(18);
  });

  it('bands are five years wide (UN age groups, from memory), split at the adult age, 65+ top-coded', () => {
    expect(bandEdges(18)).toEqual([10, 15, 18, 20, 25, 30, 35, 40, 45, 50, 55, 60, 65]);
    expect([9, 10, 14, 15, 17, 18, 19, 20, 31, 64, 65, 90].map((a) => ageBand(a))).toEqual(['<10', '10-14', '10-14', '15-17', '15-17', '18-19', '18-19', '20-24', '30-34', '60-64', '65+', '65+']);
    expect(ageBand(null)).toBe('unknown');
    // a local rule of 16 (GDPR Art. 8 lets member states choose 13-16): the band still never straddles it
    expect([15, 16, 19].map((a) => ageBand(a, 16))).toEqual(['15-15', '16-19', '16-19']);
  });

  it('a session before the adult age needs the guardian’s consent too; without a date of birth it always does', () => {
    const yes = { research: true, guardianConsent: false };
    expect(sessionConsented(yes, '2009-06-04', '2026-02-07')).toBe(false); // 16 at the session
    expect(sessionConsented(yes, '2009-06-04', '2027-06-04')).toBe(true); // 18 on that day
    expect(sessionConsented({ research: true, guardianConsent: true }, '2009-06-04', '2026-02-07')).toBe(true);
    expect(sessionConsented(yes, null, '2026-02-07')).toBe(false);
    expect(sessionConsented({ research: false, guardianConsent: true }, '1980-01-01', '2026-02-07')).toBe(false);
  });
});

describe('player codes', () => {
  it('are HMAC-SHA256 of the id under the secret, as Python’s hmac module computes it (RFC 2104)', () => {
    const secret = 'k'.repeat(16) + '0123456789abcdef0123';
    const expected = python(`import hmac,hashlib\nprint(hmac.new(b"${secret}", b"stanceline-athlete:42", hashlib.sha256).hexdigest())`).trim();
    expect(playerCode(secret, 42)).toBe(`P${expected.slice(0, 12)}`);
    expect(playerCode(secret, 42)).toBe(playerCode(secret, 42));
    expect(playerCode(secret, 43)).not.toBe(playerCode(secret, 42));
    expect(playerCode(secret.replace('k', 'j'), 42)).not.toBe(playerCode(secret, 42));
    expect(() => playerCode('short', 1)).toThrow(RangeError);
  });
});

describe('phase-table rows', () => {
  const swing: ExportSwing = {
    swingId: 7,
    playerCode: 'Pabc',
    ageBand: '25-29',
    sessionWeek: '2026-W07',
    context: 'lesson',
    club: 'iron-7',
    clubGroup: 'irons',
    handedness: 'right',
    partial: false,
    algorithmVersion: 'v',
    processing: { cutoff_hz: 20, filter_order: 2, sample_rate_hz: 100, derivative_window: 11, derivative_poly_order: 2, max_gap_s: 0.1, stance_width_mm: 400 },
    events: { address: 4.00049, top: 4.8804 },
    atEvents: { top: { lead_pct: 27.749, lead_heel_pct: null, trail_heel_pct: 62.95, cop_x_mm: -0.04, cop_y_mm: -16.6 } },
    phases: { downswing: { duration_s: 0.2204, cop_path_mm: 209.46, peak_cop_speed_mm_s: 1117.4, mean_lead_pct: 57.55 } },
    tempoRatio: 3.1449,
    targetScorePct: 66.6667,
  };

  it('long: one row per event-or-phase x measure, rounded as the analyze command rounds', () => {
    const rows = longRows(swing, false);
    expect(rows).toHaveLength(ROWS_PER_SWING_LONG);
    expect(ROWS_PER_SWING_LONG).toBe(5 * 6 + 4 * 4 + 1);
    const v = (e: string, m: string) => rows.find((r) => r.event_or_phase === e && r.measure === m)?.value;
    expect(v('address', 'time_s')).toBe(4); // 3 decimals
    expect(v('top', 'lead_pct')).toBe(27.7); // 1 decimal
    expect(v('top', 'lead_heel_pct')).toBeNull();
    expect(v('top', 'cop_x_mm')).toBe(0); // -0.04 -> 0, never -0
    expect(Object.is(v('top', 'cop_x_mm'), -0)).toBe(false);
    expect(v('downswing', 'peak_cop_speed_mm_s')).toBe(1117);
    expect(v('swing', 'tempo_ratio')).toBe(3.14);
    expect(rows[0].target_score_pct).toBe(66.7);
    expect(Object.keys(rows[0]).sort()).toEqual(columnsOf('long', false).sort());
    expect(roundTo(Number.NaN, 1)).toBeNull();
  });

  it('wide: one row per swing with every column of the codebook; identified columns only when asked', () => {
    const row = wideRow(swing, false);
    expect(Object.keys(row).sort()).toEqual(columnsOf('wide', false).sort());
    expect(row.transition_duration_s).toBeNull();
    expect(row.downswing_cop_path_mm).toBe(209.5);
    expect(row.top_time_s).toBe(4.88);
    expect(columnsOf('wide', false)).not.toContain('player_name');
    expect(columnsOf('wide', true)).toContain('player_name');
    for (const shape of ['long', 'wide'] as const) {
      const described = new Set(codebook(shape, false).map((e) => e.column));
      for (const c of columnsOf(shape, false)) expect(described.has(c), `${shape} ${c}`).toBe(true);
    }
  });
});
