import type { EvaluationWarning } from '../result.js';

export type Warn = (section: string, code: string, message: string) => void;

export function collectWarnings(): { warnings: EvaluationWarning[]; warn: Warn } {
  const warnings: EvaluationWarning[] = [];
  return { warnings, warn: (section, code, message) => warnings.push({ section, code, message }) };
}
