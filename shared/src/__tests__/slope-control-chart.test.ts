import { describe, expect, it } from 'vitest';
import { slopeControlChart } from '../runs/control-chart.js';

const points = (slopes: number[]) =>
  slopes.map((slope, i) => ({
    runId: `r${i}`,
    title: `Run ${i + 1}`,
    createdAt: `2026-11-${String(i + 1).padStart(2, '0')}`,
    model: 'linear' as const,
    slope,
  }));

describe('slope control chart', () => {
  it('should give no limits below three runs and say why', () => {
    const chart = slopeControlChart(points([1, 2]));
    expect(chart).toMatchObject({ n: 2, mean: 1.5, limits: null, message: expect.stringMatching(/at least 3/) });
    expect(chart.sd).toBeCloseTo(Math.SQRT1_2, 12);
  });

  it('should place warning and action limits at the mean ± 2 s and ± 3 s (sample SD, n − 1)', () => {
    // 2, 4, 4, 4, 5, 5, 7, 9: mean 5, sum of squares 32, s = √(32/7).
    const chart = slopeControlChart(points([2, 4, 4, 4, 5, 5, 7, 9]));
    const s = Math.sqrt(32 / 7);
    expect(chart.mean).toBe(5);
    expect(chart.sd).toBeCloseTo(s, 12);
    expect(chart.limits!.warning[0]).toBeCloseTo(5 - 2 * s, 12);
    expect(chart.limits!.action[1]).toBeCloseTo(5 + 3 * s, 12);
    expect(chart.points.flatMap((p) => p.flags)).toEqual([]);
  });

  it('should flag a slope beyond the action limits and one between the warning and action limits', () => {
    const steady = Array.from({ length: 19 }, (_, i) => 1 + (i % 2 ? 0.01 : -0.01));
    const beyond = slopeControlChart(points([...steady, 1.2]));
    expect(beyond.points.at(-1)!.flags).toEqual(['beyondAction']);
    expect(beyond.message).toMatch(/1 run beyond the action limits/);
    const warned = slopeControlChart(points([...steady, 1.025]));
    expect(warned.points.at(-1)!.flags).toEqual(['beyondWarning']);
    expect(warned.message).toBeNull();
  });

  it('should flag the seventh run in a row on one side of the mean, and not six', () => {
    // Symmetric about a mean of 1: the streaks are exactly as long as written.
    const start = [1.1, 0.9, 1.1, 0.9];
    const six = slopeControlChart(points([...start, ...Array(6).fill(1.05), ...Array(6).fill(0.95)]));
    expect(six.points.some((p) => p.flags.includes('sevenOnOneSide'))).toBe(false);
    const seven = slopeControlChart(points([...start, ...Array(7).fill(1.05), ...Array(7).fill(0.95)]));
    const flagged = seven.points.flatMap((p, i) => (p.flags.includes('sevenOnOneSide') ? [i] : []));
    expect(flagged).toEqual([10, 17]);
    expect(seven.message).toMatch(/in a row on one side of the mean/);
  });
});
