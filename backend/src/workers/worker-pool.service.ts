import { Injectable, Logger, type OnModuleDestroy } from '@nestjs/common';
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { ReportContent } from '../reports/report-content.js';
import type { ImportTable } from '../studies/import-table.js';
import type { StudyData, StudyEvaluation } from '../studies/study-evaluation.js';
import { runHeavyTask, unwrapOutcome, type HeavyOutcome, type HeavyResults, type HeavyTask } from './heavy-work.js';

/** Below this many list entries a study is evaluated in place: the thread hop would cost more than the work. */
export const INLINE_EVALUATION_ROWS = 200;

/** The compiled worker: beside this file in a build, or in dist/ when the server runs from its TypeScript sources (tests). */
function workerFile(): string | null {
  const candidates = ['./heavy-work.worker.js', '../../dist/workers/heavy-work.worker.js'].map((path) =>
    fileURLToPath(new URL(path, import.meta.url)),
  );
  return candidates.find((path) => existsSync(path)) ?? null;
}

function listEntries(data: StudyData): number {
  return Object.values(data).reduce<number>((sum, value) => sum + (Array.isArray(value) ? value.length : 0), 0);
}

@Injectable()
export class WorkerPoolService implements OnModuleDestroy {
  private readonly logger = new Logger(WorkerPoolService.name);
  private readonly pool: Piscina | null;

  constructor() {
    const filename = workerFile();
    if (!filename) this.logger.warn('No compiled worker found: heavy work runs on the main thread (build the backend to move it off).');
    this.pool = filename
      ? new Piscina({ filename, minThreads: 0, maxThreads: Math.max(1, availableParallelism() - 1), idleTimeout: 30_000 })
      : null;
  }

  evaluate(data: StudyData): Promise<StudyEvaluation> {
    if (listEntries(data) <= INLINE_EVALUATION_ROWS) return this.inline({ kind: 'evaluate', data });
    return this.run({ kind: 'evaluate', data });
  }

  /** The engine's result alone, as the command line gives it, in JSON text. */
  engine(study: Record<string, unknown>): Promise<string> {
    if (listEntries(study) <= INLINE_EVALUATION_ROWS) return this.inline({ kind: 'engine', study });
    return this.run({ kind: 'engine', study });
  }

  async renderReport(content: ReportContent): Promise<Buffer> {
    const pdf = await this.run({ kind: 'render-report', content });
    return Buffer.from(pdf.buffer, pdf.byteOffset, pdf.byteLength);
  }

  readTable(file: Buffer): Promise<ImportTable> {
    return this.run({ kind: 'read-table', file });
  }

  async onModuleDestroy(): Promise<void> {
    await this.pool?.destroy();
  }

  private async run<K extends HeavyTask['kind']>(task: Extract<HeavyTask, { kind: K }>): Promise<HeavyResults[K]> {
    if (!this.pool) return this.inline(task);
    return unwrapOutcome((await this.pool.run(task)) as HeavyOutcome<HeavyResults[K]>);
  }

  private async inline<K extends HeavyTask['kind']>(task: Extract<HeavyTask, { kind: K }>): Promise<HeavyResults[K]> {
    return unwrapOutcome((await runHeavyTask(task)) as HeavyOutcome<HeavyResults[K]>);
  }
}
