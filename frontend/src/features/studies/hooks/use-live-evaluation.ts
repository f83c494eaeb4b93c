import { evaluateStudy, StudyValidationError, type EvaluationResult, type FieldError } from '@meritline/shared';
import { useDeferredValue, useMemo } from 'react';

export interface LiveEvaluation {
  result: EvaluationResult | null;
  /** Why the engine cannot evaluate the data yet (too few standards…). */
  errors: FieldError[];
  /** The data the result belongs to (it trails the typing by a render or two). */
  data: Record<string, unknown>;
  /** The figures shown are for an earlier state of the data; new ones are being computed. */
  isUpdating: boolean;
}

function evaluate(data: Record<string, unknown>): Pick<LiveEvaluation, 'result' | 'errors'> {
  try {
    return { result: evaluateStudy(data), errors: [] };
  } catch (error) {
    if (error instanceof StudyValidationError) return { result: null, errors: error.errors };
    return {
      result: null,
      errors: [
        {
          field: 'study',
          code: 'engine_failure',
          message: 'The figures could not be computed in the browser; the server result below still applies.',
        },
      ],
    };
  }
}

/** The engine run in the browser on the deferred data, so that typing never waits for the statistics. */
export function useLiveEvaluation(data: Record<string, unknown>): LiveEvaluation {
  const deferred = useDeferredValue(data);
  const outcome = useMemo(() => evaluate(deferred), [deferred]);
  return { ...outcome, data: deferred, isUpdating: deferred !== data };
}
