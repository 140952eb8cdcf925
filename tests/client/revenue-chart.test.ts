import { createElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { RevenueChart } from '../../src/features/billing/components/revenue-chart';
import type { RevenueRow } from '../../shared/billing/views';

const attrs = (tag: string) => Object.fromEntries([...tag.matchAll(/([\w-]+)="([^"]*)"/g)].map((m) => [m[1], m[2]]));
const unescape = (text: string) => text.replace(/&amp;/g, '&').replace(/&lt;/g, '<').replace(/&gt;/g, '>');

/** The chart's SVG as the browser gets it (React's server markup), its bars, lines and axis labels read back. */
function drawn(rows: RevenueRow[]) {
  const markup = renderToStaticMarkup(createElement(RevenueChart, { rows, from: '2026-09', to: '2026-11', currency: 'EUR' }));
  const svg = markup.slice(markup.indexOf('<svg'), markup.indexOf('</svg>'));
  return {
    bars: [...svg.matchAll(/(<rect [^>]*>)<title>([^<]*)<\/title><\/rect>/g)].map((m) => ({
      y: Number(attrs(m[1]).y),
      height: Number(attrs(m[1]).height),
      title: unescape(m[2]),
    })),
    lines: [...svg.matchAll(/<line [^>]*>/g)].map((m) => {
      const a = attrs(m[0]);
      return { y1: Number(a.y1), y2: Number(a.y2), stroke: a.stroke };
    }),
    labels: [...svg.matchAll(/<text [^>]*>([^<]*)<\/text>/g)].map((m) => unescape(m[1])),
  };
}

const row = (kitName: string, month: string, revenueMinor: number): RevenueRow => ({ kitId: kitName, kitName, month, revenueMinor });

describe('the revenue chart', () => {
  // October: an invoice of 1,200.00 for kit A and a credit note of 1,500.00 for kit B (invented figures).
  const rows = [row('Kit A', '2026-09', 240_000), row('Kit A', '2026-10', 120_000), row('Kit B', '2026-10', -150_000), row('Kit B', '2026-11', 60_000)];

  it('draws no bar with a negative height, and the credit hangs below the zero line', () => {
    const { bars, lines } = drawn(rows);
    expect(bars).toHaveLength(4);
    for (const bar of bars) expect(bar.height).toBeGreaterThan(0);
    const zero = lines.find((l) => l.stroke === '#1c2536')!;
    expect(zero.y1).toBe(zero.y2);
    const credit = bars.find((b) => b.title.startsWith('Kit B') && b.title.includes('-€1,500.00'))!;
    expect(credit.y).toBeCloseTo(zero.y1, 6); // starts at zero, reaches down
    const invoice = bars.find((b) => b.title.startsWith('Kit A') && b.title.includes('€1,200.00'))!;
    expect(invoice.y + invoice.height).toBeCloseTo(zero.y1, 6); // rises to zero from above
    // Heights in proportion to the amounts: 1,500 / 1,200 (worked by hand).
    expect(credit.height / invoice.height).toBeCloseTo(1.25, 6);
  });

  it('puts a negative figure on the axis', () => {
    const { labels } = drawn(rows);
    expect(labels.some((l) => /^[-−]€/.test(l))).toBe(true);
    expect(labels).toContain('€0');
  });

  it('with no credits the axis starts at zero', () => {
    const { labels, bars } = drawn(rows.filter((r) => r.revenueMinor > 0));
    expect(labels.some((l) => /^[-−]/.test(l))).toBe(false);
    for (const bar of bars) expect(bar.height).toBeGreaterThan(0);
  });
});
