import type { StudyStatus } from '@meritline/shared';
import type { StudyMeta, ValidationStudy } from '../studies/validation-study.entity.js';

/** The new draft started from an existing study. */
export interface CopiedStudyDto {
  id: string;
  title: string;
  status: StudyStatus;
  methodVersionId: string;
  data: Record<string, unknown>;
  result: Record<string, unknown> | null;
  resultErrors: { field: string; code: string; message: string }[] | null;
  engineVersion: string;
  dataHash: string;
  meta: StudyMeta;
  authorId: string;
  editorIds: string[];
  copiedFromId: string | null;
  submittedAt: string | null;
  approvedAt: string | null;
  createdAt: string;
  updatedAt: string;
  lockVersion: number;
}

export function toCopiedStudyDto(study: ValidationStudy): CopiedStudyDto {
  return {
    id: study.id,
    title: study.title,
    status: study.status,
    methodVersionId: study.methodVersionId,
    data: study.data,
    result: study.result,
    resultErrors: study.resultErrors,
    engineVersion: study.engineVersion,
    dataHash: study.dataHash,
    meta: study.meta,
    authorId: study.authorId,
    editorIds: study.editorIds,
    copiedFromId: study.copiedFromId,
    submittedAt: study.submittedAt?.toISOString() ?? null,
    approvedAt: study.approvedAt?.toISOString() ?? null,
    createdAt: study.createdAt.toISOString(),
    updatedAt: study.updatedAt.toISOString(),
    lockVersion: study.lockVersion,
  };
}
