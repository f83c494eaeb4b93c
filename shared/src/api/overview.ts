/** What waits for the caller beyond the review queue and their own returned studies (which have endpoints of their own). */
export interface OverviewDto {
  /** The caller's runs sent back by a reviewer (analysts). */
  returnedRuns: { id: string; title: string; comment: string | null; submittedAt: string | null }[];
  /** Draft method versions, which a quality manager may activate. */
  versionsAwaitingActivation: { methodId: string; methodName: string; versionId: string; number: number; createdAt: string }[];
  /** Approvals and activations signed although criteria were not met, with the written justification (quality managers). */
  justifiedApprovals: {
    kind: 'study' | 'method-version';
    id: string;
    /** The study title, or the method name and version number. */
    title: string;
    methodId: string | null;
    signerName: string | null;
    at: string | null;
    justification: string;
  }[];
  /** Control-chart signals of the last 30 days, as e-mailed to the quality managers (quality managers). */
  driftSignals: {
    id: string;
    methodVersionId: string;
    methodName: string;
    versionNumber: number;
    series: string;
    message: string;
    at: string;
  }[];
}
