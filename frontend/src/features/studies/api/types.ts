import type { StudyDto, StudySort, StudyStatus } from '@meritline/shared';
import type { ComponentType } from 'react';
/** The reviewer's remarks on a returned study (return comment, open comments), supplied by the app from the review feature. */
export type RemarksSlot = ComponentType<{ studyId: string }>;

export interface StudyListParams {
  status?: StudyStatus;
  methodId?: string;
  mine?: boolean;
  from?: string;
  to?: string;
  q?: string;
  sort: StudySort;
  order: 'asc' | 'desc';
  cursor?: string;
  pageSize: number;
}

/** The wizard's last step, supplied by the app (the review feature signs the submission). */
export type SubmitSlot = ComponentType<{ study: StudyDto }>;
