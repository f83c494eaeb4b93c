import type { RecoveryGroup, RecoveryResult } from '../result.js';
import type { RecoveryItem } from '../study.js';
import { studentQuantile, studentTwoSidedP } from './distributions.js';
import { groupBy, mean, sd } from './stats.js';
import type { Warn } from './warnings.js';

/** Mean recovery of a group, its interval and the t-test against 100 %. */
function summarise(level: string | null, pcts: number[], confidence: number): RecoveryGroup {
  const n = pcts.length;
  const meanPct = mean(pcts);
  const sdPct = sd(pcts);
  if (sdPct === null) {
    return { level, n, meanPct, sdPct, rsdPct: null, ci: null, t: null, df: null, p: null, significant: null };
  }
  const se = sdPct / Math.sqrt(n);
  const half = studentQuantile((1 + confidence) / 2, n - 1) * se;
  const t = se > 0 ? (meanPct - 100) / se : null;
  const p = t === null ? null : studentTwoSidedP(t, n - 1);
  return {
    level,
    n,
    meanPct,
    sdPct,
    rsdPct: meanPct === 0 ? null : (100 * sdPct) / meanPct,
    ci: [meanPct - half, meanPct + half],
    t,
    df: n - 1,
    p,
    significant: p === null ? null : p < 1 - confidence,
  };
}

export function recovery(items: readonly RecoveryItem[] | undefined, confidence: number, warn: Warn): RecoveryResult | null {
  if (!items || items.length === 0) {
    warn('recovery', 'no_inputs', 'no recovery experiments in the study');
    return null;
  }
  const excluded = items.flatMap((item, index) =>
    item.excluded ? [{ index, label: item.id, value: item.found, reason: item.excluded.reason }] : [],
  );
  const used = items.filter((item) => !item.excluded);
  if (excluded.length > 0) {
    const reasons = [...new Set(excluded.map((row) => row.reason))].join('; ');
    warn(
      'recovery',
      'excluded',
      `${excluded.length} recovery experiment${excluded.length === 1 ? '' : 's'} excluded by the analyst: ${reasons}`,
    );
  }
  if (used.length === 0) {
    warn('recovery', 'all_excluded', 'every recovery experiment is excluded');
    return null;
  }
  const results = used.map((item) => ({
    id: item.id,
    level: item.level ?? null,
    pct: (100 * (item.found - (item.native ?? 0))) / item.added,
  }));
  const byLevel = [
    ...groupBy(
      results.filter((r) => r.level !== null),
      (r) => r.level,
    ).entries(),
  ].map(([level, group]) =>
    summarise(
      level,
      group.map((r) => r.pct),
      confidence,
    ),
  );
  return {
    items: results,
    excluded,
    byLevel,
    overall: summarise(
      null,
      results.map((r) => r.pct),
      confidence,
    ),
  };
}
