import type { CriterionOp, EvaluationResult } from '@meritline/shared';
import { criterionName, figureUnit, sameFigure } from './format';
import type { CriterionDefinition } from './types';

/** A criterion with the engine's verdict on it; `pass` is null when the result does not judge it. */
export interface JudgedCriterion {
  figure: string;
  op: CriterionOp;
  threshold: number | [number, number];
  name: string;
  unit?: string;
  value: number | null;
  pass: boolean | null;
}

const sameThreshold = (a: number | [number, number], b: number | [number, number]) => JSON.stringify(a) === JSON.stringify(b);

/** Pairs each criterion of the method with the engine's outcome for it (the verdict keeps the criteria's order). */
export function judgeCriteria(criteria: readonly CriterionDefinition[], result: EvaluationResult | null): JudgedCriterion[] {
  const outcomes = [...(result?.verdict.criteria ?? [])];
  const units = result?.units ?? {};
  if (criteria.length === 0) {
    return outcomes.map((o) => ({ ...o, name: criterionName(o), unit: figureUnit(o.figure, units) }));
  }
  return criteria.map((criterion) => {
    const at = outcomes.findIndex(
      (o) => sameFigure(o.figure, criterion.figure) && o.op === criterion.op && sameThreshold(o.threshold, criterion.value),
    );
    const outcome = at >= 0 ? outcomes.splice(at, 1)[0] : undefined;
    return {
      figure: criterion.figure,
      op: criterion.op,
      threshold: criterion.value,
      name: criterionName(criterion),
      unit: figureUnit(criterion.figure, units),
      value: outcome ? outcome.value : null,
      pass: outcome ? outcome.pass : null,
    };
  });
}

export function criteriaForFigure(judged: readonly JudgedCriterion[], figure: string): JudgedCriterion[] {
  return judged.filter((j) => sameFigure(j.figure, figure));
}

export function criteriaUnder(judged: readonly JudgedCriterion[], prefix: string): JudgedCriterion[] {
  return judged.filter((j) => j.figure.replace(/\[(\w+)\]/g, '.$1').startsWith(`${prefix}.`));
}
