import type { CriterionDefinition, EvaluationResult, StudyInput } from '@meritline/shared';
import type { JudgedCriterion } from './judge-criteria';

export type { CriterionDefinition };

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

/** What a figures table takes: the result, its units and the criteria already judged against it. */
export interface JudgedFiguresProps {
  result: EvaluationResult;
  units: StudyUnits;
  judged: readonly JudgedCriterion[];
}
