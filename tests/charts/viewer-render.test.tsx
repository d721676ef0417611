import { describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { SwingTraceViewer } from '@/components/charts/swing-trace-viewer';
import { TimeSeriesChart } from '@/components/charts/time-series-chart';
import { StancePathChart } from '@/components/charts/stance-path-chart';
import { ValuesPanel } from '@/components/charts/values-panel';
import { syntheticSwings } from './synthetic-swing';
import { OVERLAY_STYLE } from '@/components/charts/lib/palette';

const data = syntheticSwings(7, 2);
const [first, second] = data.swings;
const count = (html: string, needle: string) => html.split(needle).length - 1;

describe('SwingTraceViewer (static render of a synthetic swing)', () => {
  const base = {
    series: data.series,
    window: first.window,
    events: first.events,
    layout: data.layout,
    handedness: 'right' as const,
    stanceWidthMm: 400,
    sensorFrames: first.frames,
  };

  it('draws 5 event markers and 4 phase bands on each of the three time charts', () => {
    expect(data.swings.length).toBe(2); // the generator was asked for two swings and the detector found both
    const html = renderToStaticMarkup(<SwingTraceViewer {...base} />);
    expect(count(html, 'data-event-marker=')).toBe(15);
    expect(count(html, 'data-phase=')).toBe(12);
    for (const chart of ['swing-lead-share', 'swing-heel-share', 'swing-cop-speed', 'swing-stance-path']) expect(html).toContain(`data-chart="${chart}"`);
    expect(count(html, 'data-cop-event=')).toBe(5);
    expect(count(html, 'data-cursor')).toBeGreaterThanOrEqual(4); // one per chart plus the readout
    expect(count(html, 'data-sensor=')).toBe(16); // pair-8 layout: 8 per foot
    expect(count(html, 'data-chart-table')).toBe(4);
    expect(html).toContain('data-scrubber');
  });

  it('names the focusable markers as sliders in a group, never inside an img (axe nested-interactive, WCAG 4.1.2)', () => {
    const html = renderToStaticMarkup(<SwingTraceViewer {...base} onEventsChange={() => {}} />);
    const svgs = html.match(/<svg[^>]*>[\s\S]*?<\/svg>/g) ?? [];
    const withFocus = svgs.filter((svg) => svg.includes('tabindex="0"'));
    expect(withFocus).toHaveLength(1); // the lead % chart only, so the tab order stays short
    expect(withFocus[0]).toMatch(/^<svg[^>]*role="group"/);
    const sliders = withFocus[0].match(/<g[^>]*role="slider"[^>]*>/g) ?? [];
    expect(sliders).toHaveLength(5);
    expect(sliders.map((g) => /aria-label="([^"]+)"/.exec(g)?.[1])).toEqual(['Address marker', 'Top marker', 'Transition marker', 'Impact marker', 'Finish marker']);
    for (const svg of svgs) if (/^<svg[^>]*role="img"/.test(svg)) expect(svg).not.toContain('tabindex');
  });

  it('is read-only without onEventsChange: no drag handles, no undo', () => {
    const html = renderToStaticMarkup(<SwingTraceViewer {...base} />);
    expect(html).not.toContain('data-drag-event');
    expect(html).not.toContain('data-undo');
  });

  it('gives every marker a drag handle when editable, and marks an event that differs from the automatic one', () => {
    const moved = { ...first.events, top: first.events.top + 0.05 };
    const html = renderToStaticMarkup(<SwingTraceViewer {...base} events={moved} autoEvents={first.events} onEventsChange={() => {}} />);
    expect(count(html, 'data-drag-event=')).toBe(15);
    expect(count(html, 'data-corrected="true"')).toBe(3); // top, on each time chart
    expect(html).toContain('top*');
    expect(html).toContain('corrected');
  });

  it('draws the second swing dotted, lined up on impact, and the reference band', () => {
    const band = { label: 'Reference ±1 SD', axis: 'swing-pct' as const, x: [0, 50, 100], lower: [40, 20, 80], upper: [60, 40, 95], landmarks: [0, 25, 50, 75, 100] };
    const html = renderToStaticMarkup(
      <SwingTraceViewer {...base} overlay={{ label: 'swing 2', series: data.series, events: second.events }} leadBand={band} />,
    );
    expect(count(html, 'data-line="overlay-')).toBe(4); // lead %, both heels, COP speed
    expect(html).toContain(`stroke-dasharray="${OVERLAY_STYLE.dash}"`);
    expect(html).toContain('data-layer="band"');
    expect(count(html, 'data-band-edge=')).toBe(2); // lower and upper edge in the darker band hue (SC 1.4.11)
    expect(html).toContain('data-overlay-path');
  });
});

describe('TimeSeriesChart / StancePathChart / ValuesPanel on their own', () => {
  it('draws lead solid and trail dashed, each with its label', () => {
    const t = [0, 1, 2];
    const html = renderToStaticMarkup(
      <TimeSeriesChart
        id="t"
        title="Heel share"
        time={t}
        lines={[
          { id: 'a', label: 'Lead heel %', values: [10, 20, 30], tone: 'lead' },
          { id: 'b', label: 'Trail heel %', values: [30, NaN, 10], tone: 'trail' },
        ]}
        domain={[0, 2]}
        yDomain={[0, 100]}
        unit="%"
        width={300}
        height={100}
      />,
    );
    expect(html).toMatch(/data-line="a"[^>]*stroke="#0072B2"/);
    expect(html).not.toMatch(/data-line="a"[^>]*stroke-dasharray/);
    expect(html).toMatch(/data-line="b"[^>]*stroke="#D55E00"[^>]*stroke-dasharray="6 4"/);
    expect(html).toContain('Lead heel %');
    expect(html).toContain('Trail heel %');
    expect(count(html, 'data-event-marker')).toBe(0);
  });

  it('sizes sensor dots by force at the cursor (nearest stored frame)', () => {
    const html = renderToStaticMarkup(
      <StancePathChart series={data.series} domain={[first.window.startS, first.window.endS]} layout={data.layout} handedness="right" stanceWidthMm={400} width={320} height={260} cursorTime={first.events.top} sensorFrames={first.frames} table={false} />,
    );
    const radii = [...html.matchAll(/data-sensor="(\w+)"[^>]*r="([\d.]+)"/g)].map((m) => ({ id: m[1], r: Number(m[2]) }));
    expect(radii).toHaveLength(16);
    // at the top of the backswing most weight is on the trail foot (right, for a right-handed golfer: Ball & Best 2007, J Sports Sci 25(7):757-770 [citation from memory])
    const sum = (foot: string) => radii.filter((d) => d.id.startsWith(foot)).reduce((a, d) => a + d.r, 0);
    expect(sum('R')).toBeGreaterThan(sum('L'));
  });

  it('lists the cursor and the five events in the values panel', () => {
    const html = renderToStaticMarkup(<ValuesPanel series={data.series} events={first.events} cursorTime={first.events.impact} />);
    expect(count(html, 'data-values-row=')).toBe(6);
  });
});
