import { createHash } from 'node:crypto';
import { canonicalJson, type SignatureDto, type StudyStatus } from '@meritline/shared';
import type { StudySignature } from './study-signature.entity.js';

export interface SignedContent {
  data: Record<string, unknown>;
  result: Record<string, unknown> | null;
}

/** SHA-256 of the canonical JSON (RFC 8785 scheme) of what a signer vouches for. */
export function contentHash(content: SignedContent): string {
  return createHash('sha256')
    .update(canonicalJson({ data: content.data, result: content.result }))
    .digest('hex');
}

/** Signatures grouped by submission: each round opens with an `authored` signature. Oldest first. */
export function signatureRounds(signatures: readonly StudySignature[]): StudySignature[][] {
  const sorted = [...signatures].sort((a, b) => a.signedAt.getTime() - b.signedAt.getTime());
  const rounds: StudySignature[][] = [];
  for (const signature of sorted) {
    if (signature.meaning === 'authored' || !rounds.length) rounds.push([signature]);
    else rounds[rounds.length - 1].push(signature);
  }
  return rounds;
}

/** The signature that made the study approved: the release where one was required, else the reviewer's approval. */
export function approvingSignature(signatures: readonly StudySignature[]): StudySignature | null {
  const round = currentRound(signatures);
  return round.find((s) => s.meaning === 'released') ?? round.find((s) => s.meaning === 'reviewed-and-approved') ?? null;
}

/** True when at least one acceptance criterion failed (a study naming no criteria has none that failed). */
export function failsCriteria(result: Record<string, unknown> | null): boolean {
  return (result as { verdict?: { pass?: boolean | null } } | null)?.verdict?.pass === false;
}

export function currentRound(signatures: readonly StudySignature[]): StudySignature[] {
  return signatureRounds(signatures).at(-1) ?? [];
}

/**
 * Signatures of the open submission (the study is submitted or approved) are checked against the study
 * as stored now; those of a submission that was returned, or followed by another, against the content
 * their submission signed, because the data are meant to change after a return.
 */
export function toSignatureDtos(signatures: readonly StudySignature[], study: SignedContent & { status: StudyStatus }): SignatureDto[] {
  const rounds = signatureRounds(signatures);
  const open = study.status === 'submitted' || study.status === 'approved';
  return rounds.flatMap((round, index) => {
    const superseded = index < rounds.length - 1 || !open;
    const opening = round[0];
    const content: SignedContent | null = !superseded
      ? study
      : opening.dataSnapshot
        ? { data: opening.dataSnapshot, result: opening.resultSnapshot }
        : null;
    const hash = content ? contentHash(content) : null;
    return round.map((signature) => ({
      id: signature.id,
      signerId: signature.signerId,
      signerName: signature.signerName,
      signerRole: signature.signerRole,
      meaning: signature.meaning,
      signedAt: signature.signedAt.toISOString(),
      contentHash: signature.contentHash,
      comment: signature.comment,
      justification: signature.justification ?? null,
      valid: hash === signature.contentHash,
      superseded,
    }));
  });
}
