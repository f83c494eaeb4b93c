import type { Role } from './roles.js';

export interface FieldError {
  field: string;
  code: string;
  message: string;
}

/** Body of every 4xx answer; `errors` is present on 422 (and 400 for malformed input). */
export interface ApiErrorBody {
  statusCode: number;
  message: string;
  errors?: FieldError[];
}

export interface UserDto {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  active: boolean;
  invitationPending: boolean;
  createdAt: string;
  lastSignInAt: string | null;
}

export interface LoginResponse {
  accessToken: string;
  user: Pick<UserDto, 'id' | 'email' | 'name' | 'roles'>;
}

export interface OutboxMessageDto {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  receivedAt: string;
}

export type MethodVersionStatus = 'draft' | 'active' | 'retired';
export type StudyStatus = 'draft' | 'submitted' | 'returned' | 'approved';
export type SignatureMeaning = 'authored' | 'reviewed-and-approved' | 'released';
export type RunStatus = 'accepted' | 'rejected';
export type StudySection = 'setup' | 'standards' | 'blanks' | 'recovery' | 'precision' | 'results' | 'conclusion';

export interface MethodVersionSettings {
  /** A quality manager must release the study after the reviewer's approval. */
  requiresQualityRelease: boolean;
  /** Check standards in a routine run must recover within 100 ± this %. */
  checkTolerancePct: number;
  /** One-point calibration is allowed only when |intercept| is at most this % of the top response. */
  onePointMaxInterceptPct: number;
  /** Mean recoveries of two versions within this many percentage points count as equivalent (default 5). */
  recoveryEquivalenceMarginPct?: number;
  /** β of the accuracy profile's tolerance limits (0.80 unless set; 0.95 is the stricter common choice). */
  accuracyBeta?: number;
  /** Acceptance limits of the accuracy profile, ±λ % (10 unless set). */
  accuracyLambdaPct?: number;
  /** Coverage factor k of the expanded uncertainty (2 unless set). */
  coverageFactor?: number;
}
