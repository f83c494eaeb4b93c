import { accuracyProfile } from './engine/accuracy-profile.js';
import { mean, sd } from './engine/stats.js';
import { topDownUncertainty, truenessVersusReference } from './engine/uncertainty.js';
import type { Warn } from './engine/warnings.js';
import type { EvaluationResult } from './result.js';
import type { Study } from './study.js';
import type { TopDownLevel } from './uncertainty-types.js';

/**
 * Accuracy profile, trueness and top-down uncertainty. u(R_w) is s_I per accuracy level (else
 * the precision section's s_I); u(bias) comes from the reference material when there is one,
 * else from the series-mean biases of the accuracy levels, else from the spike recoveries.
 */
export function uncertaintySections(
  study: Study,
  result: EvaluationResult,
  warn: Warn,
): Pick<EvaluationResult, 'accuracyProfile' | 'trueness' | 'uncertainty'> {
  const out: Pick<EvaluationResult, 'accuracyProfile' | 'trueness' | 'uncertainty'> = {};
  const profile = study.accuracy ? accuracyProfile(study.accuracy, study.accuracyProfile) : null;
  if (profile) out.accuracyProfile = profile;
  const rm = study.referenceMaterial;
  if (rm) out.trueness = truenessVersusReference(rm);
  if (!study.uncertainty && !profile) return out;

  const uRef = study.uncertainty?.uReferencePct ?? 0;
  let rmBias: Pick<TopDownLevel, 'biasPct' | 'uReferencePct'> | null = null;
  if (rm) {
    const s = sd(rm.results) ?? 0;
    rmBias = {
      biasPct: [(100 * (mean(rm.results) - rm.certified)) / rm.certified],
      uReferencePct: (100 * Math.sqrt((s * s) / rm.results.length + rm.uCertified ** 2)) / rm.certified,
    };
  }
  let levels: TopDownLevel[];
  if (profile && study.accuracy) {
    levels = profile.levels.map((l) => {
      const items = study.accuracy!.filter((i) => i.level === l.level);
      const seriesBias = [...new Set(items.map((i) => i.series))].map(
        (s) => (100 * (mean(items.filter((i) => i.series === s).map((i) => i.found)) - l.nominal)) / l.nominal,
      );
      return { level: l.level, concentration: l.nominal, sRw: l.sI, ...(rmBias ?? { biasPct: seriesBias, uReferencePct: uRef }) };
    });
  } else if (result.precision) {
    const recoveries = result.recovery ? result.recovery.items.map((i) => i.pct - 100) : [];
    if (!rmBias && recoveries.length === 0)
      warn('uncertainty', 'no_bias', 'no reference material, accuracy or recovery results: u(bias) is taken as zero');
    levels = [
      {
        level: 'precision',
        concentration: result.precision.grandMean,
        sRw: result.precision.sI,
        ...(rmBias ?? { biasPct: recoveries, uReferencePct: uRef }),
      },
    ];
  } else {
    warn('uncertainty', 'no_inputs', 'no accuracy or precision results: no measurement uncertainty');
    return out;
  }
  out.uncertainty = topDownUncertainty(levels, study.uncertainty);
  return out;
}
