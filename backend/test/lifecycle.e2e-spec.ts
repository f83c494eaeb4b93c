import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ValidationStudy } from '../src/studies/validation-study.entity.js';
import { signedIn } from './support/flows.js';
import { calibrationData, createStudy, dataSourceOf, databaseState, evaluated, queryDatabase, userId } from './support/review-fixtures.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

const JUSTIFICATION = 'Recovery at the lowest level is outside the range, but routine samples lie well above it.';

/** The demo calibration with a criterion it cannot meet (r² of exactly 1), so the verdict fails. */
function failingData() {
  return { ...calibrationData(), criteria: [{ figure: 'calibration.r2', op: '>=' as const, value: 1 }] };
}

/** A run on the demo calibration (invented, as in the review fixtures), one check standard and one unknown. */
function runBody(methodVersionId: string, title: string) {
  return {
    methodVersionId,
    title,
    data: {
      model: 'linear',
      standards: [0.5, 1, 2, 4, 8].map((x) => ({ x, y: Number((0.004 + 0.1213 * x).toFixed(4)) })),
      checks: [{ id: 'CCV', nominal: 2, y: [0.247] }],
      unknowns: [{ id: 'W-1', y: [0.3] }],
    },
  };
}

describe('method lifecycle', () => {
  let t: TestApp;
  const rows = (sql: string, ...params: unknown[]) => queryDatabase(t, sql, ...params);

  async function failingStudy(status: ValidationStudy['status']) {
    const study = await createStudy(t, { author: DEMO.analyst, status });
    await dataSourceOf(t)
      .getRepository(ValidationStudy)
      .save({ ...study, ...evaluated(failingData()), approvedAt: status === 'approved' ? new Date() : null });
    return dataSourceOf(t).getRepository(ValidationStudy).findOneByOrFail({ id: study.id });
  }

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  describe('the demo data', () => {
    it('should keep every active demo version that has an approved study usable for runs', async () => {
      const res = await t
        .http()
        .get('/api/runs/method-choices')
        .set(await signedIn(t, DEMO.analyst))
        .expect(200);
      const approved = new Set(
        (await rows(`SELECT method_version_id FROM validation_studies WHERE status = 'approved'`)).map((r) => r.method_version_id),
      );
      const active = (res.body as { versions: { id: string; status: string; usable: boolean; reason: string | null }[] }[])
        .flatMap((method) => method.versions)
        .filter((version) => version.status === 'active' && approved.has(version.id));
      expect(active.length).toBeGreaterThan(0);
      for (const version of active) expect(version, version.reason ?? '').toMatchObject({ usable: true });
    });
  });

  describe('approving a study that does not meet its criteria', () => {
    it('should refuse the approval without a written justification (422, field justification) and change nothing', async () => {
      const study = await failingStudy('submitted');
      expect((study.result as { verdict: { pass: boolean } }).verdict.pass).toBe(false);
      const before = await databaseState(t, study.id);
      for (const justification of [undefined, 'Fine by me.']) {
        const res = await t
          .http()
          .post(`/api/studies/${study.id}/approve`)
          .set(await signedIn(t, DEMO.reviewer))
          .send({ password: DEMO_PASSWORD, lockVersion: study.lockVersion, ...(justification ? { justification } : {}) })
          .expect(422);
        expect(res.body.errors).toEqual([
          expect.objectContaining({ field: 'justification', code: justification ? 'too_short' : 'required' }),
        ]);
      }
      expect(await databaseState(t, study.id)).toEqual(before);
    });

    it('should approve with a justification, store it with the signature and show it among the signatures', async () => {
      const study = await failingStudy('submitted');
      const res = await t
        .http()
        .post(`/api/studies/${study.id}/approve`)
        .set(await signedIn(t, DEMO.reviewer))
        .send({ password: DEMO_PASSWORD, lockVersion: study.lockVersion, justification: `  ${JUSTIFICATION}  ` })
        .expect(200);
      expect(res.body).toMatchObject({ status: 'approved', signature: { meaning: 'reviewed-and-approved', justification: JUSTIFICATION } });
      expect(await rows('SELECT justification FROM study_signatures WHERE study_id = ?', study.id)).toEqual([
        { justification: JUSTIFICATION },
      ]);
      const signatures = await t
        .http()
        .get(`/api/studies/${study.id}/signatures`)
        .set(await signedIn(t, DEMO.analyst))
        .expect(200);
      expect(signatures.body).toEqual([expect.objectContaining({ justification: JUSTIFICATION })]);
      const history = await t
        .http()
        .get(`/api/studies/${study.id}/history`)
        .set(await signedIn(t, DEMO.analyst))
        .expect(200);
      expect(history.body).toEqual(
        expect.arrayContaining([expect.objectContaining({ action: 'study.approved', detail: `Justification: ${JUSTIFICATION}` })]),
      );
      const [entry] = await rows(
        `SELECT changes FROM audit_entries WHERE entity_id = ? AND action = 'signature.reviewed-and-approved'`,
        res.body.signature.id,
      );
      expect(JSON.parse(entry.changes as string)).toMatchObject({ justification: { from: null, to: JUSTIFICATION } });
    });

    it('should need no justification for a study that meets all its criteria', async () => {
      const study = await createStudy(t, { author: DEMO.analyst, status: 'submitted' });
      const res = await t
        .http()
        .post(`/api/studies/${study.id}/approve`)
        .set(await signedIn(t, DEMO.reviewer))
        .send({ password: DEMO_PASSWORD, lockVersion: study.lockVersion })
        .expect(200);
      expect(res.body.signature.justification).toBeNull();
    });
  });

  describe('routine runs', () => {
    it('should refuse a run on a version whose approved study fails its criteria without a justification (422, nothing saved)', async () => {
      const study = await failingStudy('approved');
      const count = async () => (await rows('SELECT COUNT(*) AS n FROM runs'))[0].n;
      const before = { runs: await count(), audit: (await rows('SELECT COUNT(*) AS n FROM audit_entries'))[0].n };
      const res = await t
        .http()
        .post('/api/runs')
        .set(await signedIn(t, DEMO.analyst))
        .send(runBody(study.methodVersionId, 'Run on an unjustified version'))
        .expect(422);
      expect(res.body.errors).toEqual([expect.objectContaining({ field: 'methodVersionId', code: 'not_usable' })]);
      expect(res.body.errors[0].message).toMatch(
        /does not meet all its acceptance criteria and was approved without a written justification/,
      );
      expect({ runs: await count(), audit: (await rows('SELECT COUNT(*) AS n FROM audit_entries'))[0].n }).toEqual(before);
      const options = await t
        .http()
        .get(`/api/method-versions/${study.methodVersionId}/run-options`)
        .set(await signedIn(t, DEMO.analyst))
        .expect(200);
      expect(options.body).toMatchObject({ usable: false, reason: res.body.errors[0].message });
    });

    it('should accept runs on a version whose failing study was approved with a justification', async () => {
      const study = await failingStudy('submitted');
      await t
        .http()
        .post(`/api/studies/${study.id}/approve`)
        .set(await signedIn(t, DEMO.reviewer))
        .send({ password: DEMO_PASSWORD, lockVersion: study.lockVersion, justification: JUSTIFICATION })
        .expect(200);
      await t
        .http()
        .post('/api/runs')
        .set(await signedIn(t, DEMO.analyst))
        .send(runBody(study.methodVersionId, 'Run on a justified version'))
        .expect(201);
    });
  });

  describe('change control', () => {
    let methodId: string;
    let v2: { id: string; lockVersion: number };

    beforeAll(async () => {
      const method = await t
        .http()
        .post('/api/methods')
        .set(await signedIn(t, DEMO.quality))
        .send({
          name: 'Thermometer check by lifecycle',
          analyte: 'Temperature',
          matrix: 'Water bath',
          technique: 'Resistance thermometer',
          xUnit: '°C',
          yUnit: 'Ω',
          purpose: 'assay',
        })
        .expect(201);
      methodId = method.body.id;
      const created = await t
        .http()
        .post(`/api/methods/${methodId}/versions`)
        .set(await signedIn(t, DEMO.analyst))
        .send({ changeSummary: 'New probe of another make.', changeKind: 'instrument', revalidationScope: ['recovery', 'linearity'] })
        .expect(201);
      expect(created.body).toMatchObject({
        number: 2,
        changeKind: 'instrument',
        revalidationScope: ['linearity', 'recovery'],
        coverage: { covered: false, missing: ['linearity', 'recovery'] },
        settings: { recoveryEquivalenceMarginPct: 5 },
      });
      v2 = created.body;
    });

    it('should refuse a new version without the kind of change or with an unknown one, or an unknown family (422)', async () => {
      const headers = await signedIn(t, DEMO.quality);
      const missing = await t.http().post(`/api/methods/${methodId}/versions`).set(headers).send({ changeSummary: 'No kind.' }).expect(422);
      expect(missing.body.errors).toEqual([expect.objectContaining({ field: 'changeKind' })]);
      const unknown = await t
        .http()
        .post(`/api/methods/${methodId}/versions`)
        .set(headers)
        .send({ changeSummary: 'Bad scope.', changeKind: 'other', revalidationScope: ['colour'] })
        .expect(422);
      expect(unknown.body.errors).toEqual([expect.objectContaining({ field: 'revalidationScope' })]);
      expect((await rows('SELECT COUNT(*) AS n FROM method_versions WHERE method_id = ?', methodId))[0].n).toBe(2);
    });

    it('should refuse activation without an approved study covering the scope (422 with the reason) and change nothing', async () => {
      const res = await t
        .http()
        .patch(`/api/method-versions/${v2.id}`)
        .set(await signedIn(t, DEMO.quality))
        .send({ lockVersion: v2.lockVersion, status: 'active' })
        .expect(422);
      expect(res.body.errors).toEqual([expect.objectContaining({ field: 'status', code: 'not_covered' })]);
      expect(res.body.message).toMatch(/missing: linearity, recovery/);
      expect(await rows('SELECT status, lock_version FROM method_versions WHERE id = ?', v2.id)).toEqual([
        { status: 'draft', lock_version: v2.lockVersion },
      ]);
    });

    it('should let only a quality manager activate with a justification (403 otherwise) and refuse a wrong password (401)', async () => {
      const body = { lockVersion: v2.lockVersion, status: 'active', activationJustification: JUSTIFICATION, password: DEMO_PASSWORD };
      await t
        .http()
        .patch(`/api/method-versions/${v2.id}`)
        .set(await signedIn(t, DEMO.admin))
        .send(body)
        .expect(403);
      await t
        .http()
        .patch(`/api/method-versions/${v2.id}`)
        .set(await signedIn(t, DEMO.analyst))
        .send(body)
        .expect(403);
      const short = await t
        .http()
        .patch(`/api/method-versions/${v2.id}`)
        .set(await signedIn(t, DEMO.quality))
        .send({ ...body, activationJustification: 'Trust me.', password: undefined })
        .expect(422);
      expect(short.body.errors.map((e: { field: string }) => e.field)).toEqual(['activationJustification', 'password']);
      await t
        .http()
        .patch(`/api/method-versions/${v2.id}`)
        .set(await signedIn(t, DEMO.quality))
        .send({ ...body, password: 'not-the-password' })
        .expect(401);
      expect(await rows('SELECT status FROM method_versions WHERE id = ?', v2.id)).toEqual([{ status: 'draft' }]);
    });

    it('should activate with a justification under the re-entered password and record it in the audit trail', async () => {
      const res = await t
        .http()
        .patch(`/api/method-versions/${v2.id}`)
        .set(await signedIn(t, DEMO.quality))
        .send({ lockVersion: v2.lockVersion, status: 'active', activationJustification: JUSTIFICATION, password: DEMO_PASSWORD })
        .expect(200);
      expect(res.body).toMatchObject({ status: 'active', activationJustification: JUSTIFICATION });
      const entries = await rows(
        `SELECT actor_id, changes, reason FROM audit_entries WHERE entity_id = ? AND action = 'method-version.activated-with-justification'`,
        v2.id,
      );
      expect(entries).toHaveLength(1);
      expect(entries[0].reason).toBe(JUSTIFICATION);
      expect(entries[0].actor_id).toBe(await userId(t, DEMO.quality));
      expect(JSON.parse(entries[0].changes as string)).toMatchObject({
        status: { from: 'draft', to: 'active' },
        signatureMeaning: { to: 'activated with justification' },
      });
    });

    it('should activate without justification once an approved study of the version shows the scope again', async () => {
      const headers = await signedIn(t, DEMO.quality);
      const v3 = (
        await t
          .http()
          .post(`/api/methods/${methodId}/versions`)
          .set(headers)
          .send({ changeSummary: 'Range extended.', changeKind: 'range', revalidationScope: ['linearity'] })
          .expect(201)
      ).body;
      await t
        .http()
        .patch(`/api/method-versions/${v3.id}`)
        .set(headers)
        .send({ lockVersion: v3.lockVersion, status: 'active' })
        .expect(422);
      const repo = dataSourceOf(t).getRepository(ValidationStudy);
      const authorId = await userId(t, DEMO.analyst);
      await repo.save(
        repo.create({
          methodVersionId: v3.id,
          title: 'Linearity over the extended range',
          status: 'approved',
          ...evaluated(calibrationData()),
          meta: {},
          authorId,
          editorIds: [authorId],
          copiedFromId: null,
          submittedAt: new Date(),
          approvedAt: new Date(),
        }),
      );
      const read = (await t.http().get(`/api/method-versions/${v3.id}`).set(headers).expect(200)).body;
      expect(read.coverage).toMatchObject({ covered: true, missing: [] });
      const res = await t
        .http()
        .patch(`/api/method-versions/${v3.id}`)
        .set(headers)
        .send({ lockVersion: read.lockVersion, status: 'active' })
        .expect(200);
      expect(res.body).toMatchObject({ status: 'active', activationJustification: null });
    });

    it('should store the recovery equivalence margin and refuse one at or below 0 (422)', async () => {
      const headers = await signedIn(t, DEMO.quality);
      for (const margin of [0, -2]) {
        const res = await t
          .http()
          .post(`/api/methods/${methodId}/versions`)
          .set(headers)
          .send({ changeSummary: 'Margin.', changeKind: 'criteria', settings: { recoveryEquivalenceMarginPct: margin } })
          .expect(422);
        expect(res.body.errors).toEqual([expect.objectContaining({ field: 'settings.recoveryEquivalenceMarginPct' })]);
      }
      const res = await t
        .http()
        .post(`/api/methods/${methodId}/versions`)
        .set(headers)
        .send({ changeSummary: 'Tighter margin.', changeKind: 'criteria', settings: { recoveryEquivalenceMarginPct: 2.5 } })
        .expect(201);
      expect(res.body.settings.recoveryEquivalenceMarginPct).toBe(2.5);
    });
  });
});
