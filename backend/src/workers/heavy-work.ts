import { HttpException } from '@nestjs/common';
import { evaluateStudy, StudyValidationError, type StudyFieldError } from '@meritline/shared';
import type { ReportContent } from '../reports/report-content.js';
import { renderValidationReport } from '../reports/validation-report.document.js';
import { readImportTable, type ImportTable } from '../studies/import-table.js';
import { evaluateStudyData, type StudyData, type StudyEvaluation } from '../studies/study-evaluation.js';

/** Work that can hold a CPU for long: done in a worker thread so the server keeps answering. */
export type HeavyTask =
  | { kind: 'evaluate'; data: StudyData }
  | { kind: 'engine'; study: Record<string, unknown> }
  | { kind: 'render-report'; content: ReportContent }
  | { kind: 'read-table'; file: Uint8Array };

export interface HeavyResults {
  evaluate: StudyEvaluation;
  /** The result as JSON text: one flat string crosses the thread boundary, not a graph of thousands of objects. */
  engine: string;
  'render-report': Uint8Array;
  'read-table': ImportTable;
}

/** Errors cross the thread boundary as data and are thrown again, with their class, on the main thread. */
export type HeavyOutcome<T = unknown> =
  | { ok: true; value: T }
  | { ok: false; http: { status: number; body: string | object } }
  | { ok: false; invalid: StudyFieldError[] }
  | { ok: false; failure: string };

async function perform(task: HeavyTask): Promise<unknown> {
  switch (task.kind) {
    case 'evaluate':
      return evaluateStudyData(task.data);
    case 'engine':
      return JSON.stringify(evaluateStudy(task.study));
    case 'render-report':
      return renderValidationReport(task.content);
    case 'read-table':
      return readImportTable(Buffer.from(task.file.buffer, task.file.byteOffset, task.file.byteLength));
  }
}

export async function runHeavyTask(task: HeavyTask): Promise<HeavyOutcome> {
  try {
    return { ok: true, value: await perform(task) };
  } catch (error) {
    if (error instanceof HttpException) return { ok: false, http: { status: error.getStatus(), body: error.getResponse() } };
    if (error instanceof StudyValidationError) return { ok: false, invalid: error.errors };
    return { ok: false, failure: (error as Error).stack ?? String(error) };
  }
}

export function unwrapOutcome<T>(outcome: HeavyOutcome<T>): T {
  if (outcome.ok) return outcome.value;
  if ('http' in outcome) throw new HttpException(outcome.http.body, outcome.http.status);
  if ('invalid' in outcome) throw new StudyValidationError(outcome.invalid);
  throw new Error(`A worker thread failed: ${outcome.failure}`);
}
