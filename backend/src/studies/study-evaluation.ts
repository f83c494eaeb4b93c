import { Logger } from '@nestjs/common';
import { createHash } from 'node:crypto';
import {
  canonicalJson,
  ENGINE_VERSION,
  evaluateStudy,
  parseStudy,
  StudyValidationError,
  withVersionOptions,
  type StudyFieldError,
} from '@meritline/shared';
import type { MethodVersion } from '../methods/method-version.entity.js';
import type { Method } from '../methods/method.entity.js';

export type StudyData = Record<string, unknown>;

export interface StudyEvaluation {
  result: Record<string, unknown> | null;
  resultErrors: StudyFieldError[] | null;
  engineVersion: string;
  dataHash: string;
}

const logger = new Logger('StudyEvaluation');

/** Model requirements a draft may not meet yet (too few standards…), as opposed to malformed data. */
function isIncomplete(error: StudyFieldError): boolean {
  if (['too_few', 'too_few_levels', 'all_x_equal', 'too_many_levels', 'incompatible'].includes(error.code)) return true;
  if (error.code === 'required') return /^standards(\[\d+\]\.sd)?$/.test(error.field);
  if (error.code === 'not_positive') return /^standards(\[\d+\]\.x)?$/.test(error.field);
  return false;
}

export function dataHash(data: StudyData): string {
  return createHash('sha256').update(canonicalJson(data)).digest('hex');
}

/**
 * The study data as stored: the method version's acceptance criteria (the version owns them, so a
 * study cannot loosen them), the method's units unless the data name their own, and the version's
 * accuracy-profile β and λ and coverage factor where the study states none.
 */
export function withMethodDefaults(data: StudyData, version: MethodVersion, method: Method): StudyData {
  return {
    ...withVersionOptions(data, version.settings),
    units: data.units ?? { x: method.xUnit, y: method.yUnit },
    criteria: version.criteria.map(({ figure, op, value }) => ({ figure, op, value })),
  };
}

/**
 * The server's result for exactly these data. Malformed data throw the engine's StudyValidationError
 * (answered 422); data a draft has not completed yet give `result: null` and the reasons.
 */
export function evaluateStudyData(data: StudyData): StudyEvaluation {
  const stamp = { engineVersion: ENGINE_VERSION, dataHash: dataHash(data) };
  try {
    parseStudy(data);
  } catch (error) {
    if (!(error instanceof StudyValidationError) || !error.errors.every(isIncomplete)) throw error;
  }
  try {
    return { result: evaluateStudy(data) as unknown as Record<string, unknown>, resultErrors: null, ...stamp };
  } catch (error) {
    if (error instanceof StudyValidationError) return { result: null, resultErrors: error.errors, ...stamp };
    logger.error(`The engine failed on study data ${stamp.dataHash}: ${(error as Error).stack ?? String(error)}`);
    return {
      result: null,
      resultErrors: [
        {
          field: 'study',
          code: 'engine_failure',
          message: 'The statistics engine could not evaluate these data; the failure is in the server log.',
        },
      ],
      ...stamp,
    };
  }
}
