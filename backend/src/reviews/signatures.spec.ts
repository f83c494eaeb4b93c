import { describe, expect, it } from 'vitest';
import { contentHash, currentRound, toSignatureDtos } from './signatures.js';
import type { StudySignature } from './study-signature.entity.js';

const v1 = { data: { standards: [{ x: 1, y: 0.1 }] }, result: { verdict: { pass: true } } };
const v2 = { data: { standards: [{ x: 1, y: 0.11 }] }, result: { verdict: { pass: true } } };

let clock = Date.parse('2026-11-02T09:00:00Z');
function signature(meaning: StudySignature['meaning'], content: typeof v1, snapshot = meaning === 'authored'): StudySignature {
  clock += 60_000;
  return {
    id: `s${clock}`,
    studyId: 'study',
    signerId: 'u',
    signerName: 'Someone',
    signerRole: 'analyst',
    meaning,
    signedAt: new Date(clock),
    contentHash: contentHash(content),
    comment: null,
    dataSnapshot: snapshot ? content.data : null,
    resultSnapshot: snapshot ? content.result : null,
  } as StudySignature;
}

describe('electronic signature checks', () => {
  it('should hash the same content to the same value whatever the key order', () => {
    expect(contentHash({ result: v1.result, data: v1.data } as typeof v1)).toBe(contentHash(v1));
    expect(contentHash(v2)).not.toBe(contentHash(v1));
  });

  it('should check current signatures against the stored study and earlier ones against what their round signed', () => {
    const signatures = [signature('authored', v1), signature('authored', v2), signature('reviewed-and-approved', v2)];
    expect(currentRound(signatures).map((s) => s.meaning)).toEqual(['authored', 'reviewed-and-approved']);
    expect(toSignatureDtos(signatures, { ...v2, status: 'submitted' }).map((s) => [s.valid, s.superseded])).toEqual([
      [true, true],
      [true, false],
      [true, false],
    ]);
  });

  it('should show a signature as broken once the content it covers changes', () => {
    const signatures = [signature('authored', v1), signature('reviewed-and-approved', v1)];
    expect(toSignatureDtos(signatures, { ...v2, status: 'approved' }).map((s) => s.valid)).toEqual([false, false]);
  });

  it('should keep the signature of a returned submission intact while the author changes the data', () => {
    const signatures = [signature('authored', v1)];
    expect(toSignatureDtos(signatures, { ...v2, status: 'returned' }).map((s) => [s.valid, s.superseded])).toEqual([[true, true]]);
  });
});
