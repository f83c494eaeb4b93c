import type { EvaluationResult, Role, SignatureMeaning, StudyInput, StudyStatus } from '@meritline/shared';

/** Everything a validation report shows, gathered from the database before rendering. */
export interface ReportContent {
  laboratoryName: string;
  /** Where anyone can check a copy of the signed report. */
  verifyUrl: string;
  /** Null for a draft preview, which is never issued. */
  reportId: string | null;
  issuedAt: Date;
  method: { name: string; analyte: string; matrix: string; technique: string; xUnit: string; yUnit: string };
  version: {
    number: number;
    changeSummary: string;
    /** Criteria as the method version defines them; `label` names a criterion in the lab's words. */
    criteria: { figure: string; op: string; value: number | [number, number]; label?: string }[];
  };
  study: {
    id: string;
    title: string;
    status: StudyStatus;
    data: StudyInput;
    result: EvaluationResult | null;
    resultErrors: { field: string; code: string; message: string }[] | null;
    engineVersion: string;
    dataHash: string;
    meta: { instrument?: string; startedOn?: string; finishedOn?: string; conclusion?: string };
    createdAt: Date;
    submittedAt: Date | null;
    approvedAt: Date | null;
  };
  signatures: {
    signerName: string;
    signerRole: Role;
    meaning: SignatureMeaning;
    signedAt: Date;
    contentHash: string;
    comment: string | null;
    justification?: string | null;
  }[];
  comments: {
    id: string;
    threadId: string | null;
    section: string;
    authorName: string;
    body: string;
    resolved: boolean;
    createdAt: Date;
  }[];
  /** The saved preparations the study's standards name, in the order first named. */
  preparations: {
    id: string;
    name: string;
    material: { name: string; supplier: string; lot: string; certificateNumber: string; expiresOn: string } | null;
    source: { purity: number; uPurity: number };
    stock: { concentration: number; u: number; unit: string };
    steps: { concentration: number; u: number }[];
    /** Indices (0-based) of the study's standards that name it. */
    standards: number[];
    savedBy: string;
    savedAt: Date;
  }[];
  /** Audit entries that excluded (or restored) points of this study. */
  exclusions: {
    at: Date;
    actorName: string;
    action: string;
    changes: Record<string, { from: unknown; to: unknown }> | null;
    reason: string | null;
  }[];
}
