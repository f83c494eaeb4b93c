import { createHash } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { canonicalJson, ENGINE_VERSION, RunReviewStatus, type RunPreviewDto } from '@meritline/shared';
import { createdFields, type AuditService } from '../audit/audit.service.js';
import { Run } from './run.entity.js';

export interface NewRun {
  methodVersionId: string;
  title: string;
  evaluation: RunPreviewDto;
  author: { id: string; name: string };
  createdAt: Date;
  /** A correction names the run it replaces and why. */
  supersedes?: { id: string; reason: string };
}

const sha256 = (text: string) => createHash('sha256').update(text).digest('hex');

/** What a run's signatures sign: its data and result. */
export const runContentHash = (run: Pick<Run, 'data' | 'result'>): string => sha256(canonicalJson({ data: run.data, result: run.result }));

/** Stores a calculated run and its audit entry in the caller's transaction. */
export async function saveCalculatedRun(manager: EntityManager, audit: AuditService, run: NewRun): Promise<Run> {
  const { evaluation, author, supersedes } = run;
  const saved = await manager.save(
    manager.create(Run, {
      methodVersionId: run.methodVersionId,
      title: run.title,
      status: evaluation.status,
      model: evaluation.data.model,
      data: evaluation.data,
      result: evaluation.result as unknown as Record<string, unknown>,
      rejectionReasons: evaluation.rejectionReasons,
      engineVersion: ENGINE_VERSION,
      dataHash: sha256(canonicalJson(evaluation.data)),
      authorId: author.id,
      createdAt: run.createdAt,
      reviewStatus: RunReviewStatus.Calculated,
      lockVersion: 1,
      ...(supersedes ? { supersedesId: supersedes.id, supersedeReason: supersedes.reason } : {}),
    }),
  );
  await audit.record(
    {
      actor: author,
      action: 'run.created',
      entity: 'run',
      entityId: saved.id,
      changes: createdFields({
        methodVersionId: saved.methodVersionId,
        model: saved.model,
        status: saved.status,
        dataHash: saved.dataHash,
        ...(supersedes ? { supersedesId: supersedes.id } : {}),
      }),
      ...(supersedes ? { reason: supersedes.reason } : {}),
    },
    manager,
  );
  return saved;
}
