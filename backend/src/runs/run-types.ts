import type { RunResult, RunStatus } from '@meritline/shared';

export const RUN_DATA_KEYS = ['model', 'weighting', 'twoPoint', 'standards', 'checks', 'unknowns', 'blanks', 'qcSamples'] as const;

export interface RunSettings {
  checkTolerancePct: number;
  onePointMaxInterceptPct: number;
}

export interface RunEvaluation {
  data: Record<string, unknown>;
  status: RunStatus;
  result: RunResult;
  rejectionReasons: string[];
}
