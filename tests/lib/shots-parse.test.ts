import { describe, expect, it } from 'vitest';
import { DEFAULT_SHOT_PROFILE, shotProfileSchema, type ShotProfile } from '@/lib/contracts/shots';
import { alignIntervals } from '@/lib/signal/align-intervals';
import { parseNumber, parseShotLog, parseShotTime, ShotFileError, splitLine } from '@/lib/shots/parse';
import { distanceFromM, distanceToM, speedFromMps, speedToMps } from '@/lib/shots/units';
import { clockCase, lcg } from '../signal/clock-case';

// Unit conversion against the exact definitions of NIST SP 811 (Guide for the Use of the SI, appendix B):
// 1 yd = 0.9144 m exactly, 1 mph = 0.44704 m/s exactly, 1 km/h = 1/3.6 m/s.
describe('units (NIST SP 811 exact definitions)', () => {
  it('converts yards, mph and km/h to SI and back', () => {
    expect(distanceToM(100, 'yd')).toBeCloseTo(91.44, 12);
    expect(distanceToM(1760, 'yd')).toBeCloseTo(1609.344, 9); // 1 mile = 1609.344 m exactly (NIST SP 811)
    expect(speedToMps(100, 'mph')).toBeCloseTo(44.704, 12);
    expect(speedToMps(36, 'km/h')).toBeCloseTo(10, 12);
    expect(speedFromMps(44.704, 'mph')).toBeCloseTo(100, 12);
    expect(distanceFromM(91.44, 'yd')).toBeCloseTo(100, 12);
    expect(speedToMps(7, 'm/s')).toBe(7);
  });
});

describe('parseShotLog(text, profile, sessionDate)', () => {
  it('reads our own plain layout (the default profile) into SI values', () => {
    const csv = '# format: stanceline-shots/1\nshot_time,club,ball_speed_m_s,carry_m,total_m,launch_deg,spin_rpm,offline_m\n2026-02-10T10:01:05.250,iron-7,50.5,148.2,160.0,17.1,6650,-3.2\n2026-02-10T10:01:40.000,iron-7,51,,,,,\n';
    const shots = parseShotLog(csv, DEFAULT_SHOT_PROFILE, '2026-02-10');
    expect(shots).toHaveLength(2);
    expect(shots[0]).toMatchObject({ line: 3, club: 'iron-7', ballSpeed: 50.5, carry: 148.2, total: 160, launchAngle: 17.1, spin: 6650, offline: -3.2 });
    expect(shots[0].deviceTimeS).toBeCloseTo(Date.UTC(2026, 1, 10, 10, 1, 5) / 1000 + 0.25, 6);
    expect(shots[1]).toMatchObject({ carry: null, spin: null });
  });

  it('reads semicolons with decimal commas, mph and yards, and tabs', () => {
    const profile: ShotProfile = shotProfileSchema.parse({
      delimiter: ';',
      decimal: ',',
      columns: { time: 'Time', ball_speed: 'Ball', carry: 'Carry' },
      units: { ball_speed: 'mph', carry: 'yd' },
    });
    const shots = parseShotLog('Time;Ball;Carry\n10:00:01,5;112,3;165,0\n', profile, '2026-02-10');
    expect(shots[0].ballSpeed).toBeCloseTo(112.3 * 0.44704, 12);
    expect(shots[0].carry).toBeCloseTo(165 * 0.9144, 12);
    expect(shots[0].deviceTimeS).toBeCloseTo(Date.UTC(2026, 1, 10, 10, 0, 1) / 1000 + 0.5, 6);
    const tsv = parseShotLog('t\tv\n12.5\t180\n', { columns: { time: 't', ball_speed: 'v' }, units: { ball_speed: 'km/h' } }, '2026-02-10');
    expect(tsv[0]).toMatchObject({ deviceTimeS: 12.5 });
    expect(tsv[0].ballSpeed).toBeCloseTo(50, 12);
  });

  it('names line and column of every bad cell, and a missing header column', () => {
    const bad = 'shot_time,club,ball_speed_m_s,carry_m,total_m,launch_deg,spin_rpm,offline_m\n10:00:00,7i,fast,1,1,1,1,1\nlater,7i,50,1,1,1,1,1\n';
    try {
      parseShotLog(bad, DEFAULT_SHOT_PROFILE, '2026-02-10');
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(ShotFileError);
      expect((error as ShotFileError).problems.map((p) => [p.line, p.column])).toEqual([
        [2, 3],
        [3, 1],
      ]);
      expect((error as ShotFileError).message).toContain('line 2, column 3');
    }
    expect(() => parseShotLog('time,speed\n1,2\n', DEFAULT_SHOT_PROFILE, '2026-02-10', false)).toThrow(/line 1: the header has no column "shot_time"/);
    expect(() => parseShotLog('shot_time,carry_m\n1,2\n', DEFAULT_SHOT_PROFILE, '2026-02-10')).toThrow(/line 1: the header has no column "club"/);
    expect(parseShotLog('shot_time,carry_m\n1,2\n', DEFAULT_SHOT_PROFILE, '2026-02-10', false)[0]).toMatchObject({ carry: 2, ballSpeed: null });
    expect(() => parseShotLog('shot_time\n2\n1\n', DEFAULT_SHOT_PROFILE, '2026-02-10', false)).toThrow(/line 3, column 1: the shot time goes backwards/);
    expect(() => parseShotLog('shot_time\n', DEFAULT_SHOT_PROFILE, '2026-02-10', false)).toThrow(/no shots/);
    expect(() => parseShotLog('a,b\n', { decimal: ',', delimiter: ',', columns: { time: 'a' }, units: {} }, '2026-02-10')).toThrow(/decimal comma needs another delimiter/);
  });

  it('splits quoted fields and reads numbers in either decimal mark', () => {
    expect(splitLine('"a;b";"say ""hi""";3', ';')).toEqual(['a;b', 'say "hi"', '3']);
    expect(parseNumber('1,5', ',')).toBe(1.5);
    expect(parseNumber('1,5', '.')).toBeNull();
    expect(parseNumber('-2.5e1', '.')).toBe(-25);
    expect(parseShotTime('2026-02-10T10:00:00+01:00', '.', '2026-02-10')).toBe(Date.UTC(2026, 1, 10, 9) / 1000);
    expect(parseShotTime('25:00:00', '.', '2026-02-10')).toBeNull();
  });
});

// The offset finder end to end from files: constructed sessions (truth = construction, see tests/signal/clock-case.ts)
// written as shot logs in other units, delimiters and decimal marks, read back and aligned.
describe('offset recovery from generated shot logs', () => {
  const layouts: { name: string; profile: ShotProfile; write: (t: number, mps: number) => string; header: string }[] = [
    { name: 'our layout, seconds', profile: DEFAULT_SHOT_PROFILE, header: 'shot_time,ball_speed_m_s', write: (t, v) => `${t.toFixed(3)},${v.toFixed(2)}` },
    {
      name: 'semicolon, decimal comma, mph, clock times',
      profile: { delimiter: ';', decimal: ',', columns: { time: 'Zeit', ball_speed: 'Ball' }, units: { ball_speed: 'mph' } },
      header: 'Zeit;Ball',
      write: (t, v) => {
        const h = Math.floor(t / 3600);
        const m = Math.floor((t % 3600) / 60);
        const s = (t % 60).toFixed(3).padStart(6, '0');
        return `${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}:${s.replace('.', ',')};${speedFromMps(v, 'mph').toFixed(1).replace('.', ',')}`;
      },
    },
    {
      name: 'tab-separated, km/h, ISO date-times',
      profile: { columns: { time: 'when', ball_speed: 'speed' }, units: { ball_speed: 'km/h' } },
      header: 'when\tspeed',
      write: (t, v) => `${new Date(Date.UTC(2026, 1, 10) + t * 1000).toISOString()}\t${speedFromMps(v, 'km/h').toFixed(1)}`,
    },
  ];

  for (const layout of layouts) {
    it(`${layout.name}: within 50 ms of the constructed offset (offsets in ±120 s, 10 % missing, 10 % extra)`, () => {
      for (let seed = 30; seed < 38; seed++) {
        const c = clockCase(seed, 40);
        const rnd = lcg(seed + 1000);
        const base = 10 * 3600; // the session starts at 10:00 on both clocks before the offset
        const text = [layout.header, ...c.shots.map((t) => layout.write(base + t, 45 + 10 * rnd()))].join('\n');
        const shots = parseShotLog(text, layout.profile, '2026-02-10', layout.profile !== DEFAULT_SHOT_PROFILE);
        expect(shots).toHaveLength(c.shots.length);
        const times = shots.map((s) => s.deviceTimeS);
        // clock times and date-times are read as seconds since the epoch; plain seconds as they are
        const origin = layout.profile === DEFAULT_SHOT_PROFILE ? 0 : Date.UTC(2026, 1, 10) / 1000;
        const found = alignIntervals(times, c.impacts.map((t) => t + base), { toleranceS: 1.5 });
        expect(Math.abs(found.offsetS! - origin - c.offsetS), `seed ${seed}`).toBeLessThan(0.05);
      }
    });
  }
});
