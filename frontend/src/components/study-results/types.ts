import type { CriterionOp, EvaluationResult, StudyInput } from '@meritline/shared';

/** An acceptance criterion as a method version states it; `label` names it for people. */
export interface CriterionDefinition {
  figure: string;
  op: CriterionOp;
  value: number | [number, number];
  level?: string | number;
  label?: string;
}

export interface StudyUnits {
  x?: string;
  y?: string;
}

/** What every study-result display takes: the study's data, the engine's result for it, its units and criteria. */
export interface StudyResultsProps {
  data: StudyInput;
  result: EvaluationResult;
  units: StudyUnits;
  criteria: readonly CriterionDefinition[];
}
