import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signedIn } from './support/flows.js';
import { queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

type Row = Record<string, unknown>;

const NITRATE = 'Nitrate in drinking water by ion chromatography';
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

describe('methods, versions and criteria templates', () => {
  let t: TestApp;
  const auth = async (email: string) => ({ Authorization: `Bearer ${await t.tokenFor(email)}` });
  const rows = (sql: string, ...params: unknown[]) => queryDatabase(t, sql, ...params);
  const newMethod = (name: string, extra: Row = {}) => ({
    name,
    analyte: 'Sulfate',
    matrix: 'Groundwater',
    technique: 'Ion chromatography',
    xUnit: 'mg/L',
    yUnit: 'µS·min',
    purpose: 'environmental',
    ...extra,
  });

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  describe('GET /api/criteria-templates', () => {
    it('should refuse anonymous callers', async () => {
      await t.http().get('/api/criteria-templates').expect(401);
    });

    it('should give every signed-in role the templates in the engine’s criteria format, labelled as common practice', async () => {
      const res = await t
        .http()
        .get('/api/criteria-templates')
        .set(await signedIn(t, DEMO.reviewer))
        .expect(200);
      expect(res.body.map((template: Row) => template.key)).toEqual(['assay', 'impurity', 'residue', 'environmental']);
      for (const template of res.body) {
        expect(template).toMatchObject({
          name: expect.any(String),
          description: expect.any(String),
          note: expect.stringMatching(/common practice/i),
        });
        expect(template.criteria.length).toBeGreaterThan(0);
        for (const criterion of template.criteria) {
          expect(criterion).toMatchObject({ figure: expect.stringMatching(/^[a-z][A-Za-z]+\./), op: expect.any(String) });
        }
      }
      const assay = res.body.find((template: Row) => template.key === 'assay');
      expect(assay.name).toBe('Assay of a major component');
      // Common practice for assays (ICH Q2(R2) leaves the numbers to the laboratory): r² ≥ 0.999, recovery 98–102 %, repeatability RSD ≤ 2 %.
      expect(assay.criteria).toEqual(
        expect.arrayContaining([
          expect.objectContaining({ figure: 'calibration.r2', op: '>=', value: 0.999 }),
          expect.objectContaining({ figure: 'recovery.overall.meanPct', op: 'between', value: [98, 102] }),
          expect.objectContaining({ figure: 'precision.rsdR', op: '<=', value: 2 }),
        ]),
      );
      const residue = res.body.find((template: Row) => template.key === 'residue');
      // Residue analysis, common practice (recalled from the EU pesticide residue guidance): recovery 70–120 %, RSD ≤ 20 %.
      expect(residue.criteria).toEqual(
        expect.arrayContaining([
          expect.objectContaining({ figure: 'recovery.overall.meanPct', op: 'between', value: [70, 120] }),
          expect.objectContaining({ figure: 'precision.rsdR', op: '<=', value: 20 }),
        ]),
      );
    });
  });

  describe('reading methods', () => {
    it('should refuse anonymous callers', async () => {
      await t.http().get('/api/methods').expect(401);
      await t.http().get(`/api/methods/${UNKNOWN_ID}`).expect(401);
      await t.http().get(`/api/method-versions/${UNKNOWN_ID}`).expect(401);
    });

    it('should list the demo methods with their versions in order, the creator and the study counts', async () => {
      const res = await t
        .http()
        .get('/api/methods')
        .set(await signedIn(t, DEMO.reviewer))
        .expect(200);
      expect(res.body).toHaveLength(4);
      const nitrate = res.body.find((method: Row) => method.name === NITRATE);
      expect(nitrate).toMatchObject({
        analyte: expect.stringMatching(/^Nitrate/),
        xUnit: 'mg/L',
        yUnit: 'µS·min',
        purpose: 'environmental',
      });
      expect(nitrate.versions.map((v: Row) => [v.number, v.status])).toEqual([
        [1, 'retired'],
        [2, 'active'],
      ]);
      expect(nitrate.versions[1]).toMatchObject({
        createdBy: { id: expect.any(String), name: 'Jonas Lindqvist' },
        studyCount: 2,
        approvedStudyCount: 1,
        lockVersion: 1,
        settings: { requiresQualityRelease: true, checkTolerancePct: expect.any(Number), onePointMaxInterceptPct: expect.any(Number) },
      });
      expect(Object.keys(nitrate.versions[1]).sort()).toEqual(
        [
          'activationJustification',
          'approvedStudyCount',
          'changeKind',
          'changeSummary',
          'coverage',
          'createdAt',
          'createdBy',
          'criteria',
          'id',
          'lockVersion',
          'number',
          'revalidationScope',
          'settings',
          'status',
          'studyCount',
        ].sort(),
      );
    });

    it('should give one method, one version with its method, 404 for an unknown id and 400 for a malformed one', async () => {
      const headers = await signedIn(t, DEMO.analyst);
      const [nitrate] = (await t.http().get('/api/methods').set(headers)).body.filter((m: Row) => m.name === NITRATE);
      const one = await t.http().get(`/api/methods/${nitrate.id}`).set(headers).expect(200);
      expect(one.body).toEqual(nitrate);
      const version = await t.http().get(`/api/method-versions/${nitrate.versions[1].id}`).set(headers).expect(200);
      expect(version.body).toEqual({
        ...nitrate.versions[1],
        method: {
          id: nitrate.id,
          name: NITRATE,
          analyte: nitrate.analyte,
          matrix: nitrate.matrix,
          technique: nitrate.technique,
          xUnit: 'mg/L',
          yUnit: 'µS·min',
          purpose: 'environmental',
        },
      });
      await t.http().get(`/api/methods/${UNKNOWN_ID}`).set(headers).expect(404);
      await t.http().get(`/api/method-versions/${UNKNOWN_ID}`).set(headers).expect(404);
      await t.http().get('/api/methods/not-a-uuid').set(headers).expect(400);
    });
  });

  describe('POST /api/methods', () => {
    it('should refuse anonymous callers (401) and reviewers (403), saving nothing', async () => {
      await t.http().post('/api/methods').send(newMethod('Refused method')).expect(401);
      await t
        .http()
        .post('/api/methods')
        .set(await signedIn(t, DEMO.reviewer))
        .send(newMethod('Refused method'))
        .expect(403);
      expect(await rows('SELECT id FROM methods WHERE name = ?', 'Refused method')).toHaveLength(0);
    });

    it('should create a method with version 1 in draft and the template’s criteria and settings', async () => {
      const templates = (
        await t
          .http()
          .get('/api/criteria-templates')
          .set(await signedIn(t, DEMO.quality))
      ).body;
      const environmental = templates.find((template: Row) => template.key === 'environmental');
      const res = await t
        .http()
        .post('/api/methods')
        .set(await signedIn(t, DEMO.quality))
        .send(newMethod('Sulfate in groundwater by IC'))
        .expect(201);
      expect(res.body).toMatchObject({ name: 'Sulfate in groundwater by IC', purpose: 'environmental' });
      expect(res.body.versions).toHaveLength(1);
      expect(res.body.versions[0]).toMatchObject({
        number: 1,
        status: 'draft',
        changeSummary: 'First version.',
        criteria: environmental.criteria,
        settings: environmental.settings,
        createdBy: { name: 'Jonas Lindqvist' },
        studyCount: 0,
      });
      const audit = await rows(
        `SELECT action FROM audit_entries WHERE entity_id IN (?, ?) ORDER BY seq`,
        res.body.id,
        res.body.versions[0].id,
      );
      expect(audit.map((entry) => entry.action)).toEqual(['method.created', 'method-version.created']);
    });

    it('should let an analyst propose a method (always a draft) with criteria and settings of their own', async () => {
      const criteria = [{ figure: 'calibration.r2', op: '>=', value: 0.998, label: 'r² at least 0.998' }];
      const res = await t
        .http()
        .post('/api/methods')
        .set(await signedIn(t, DEMO.analyst))
        .send(
          newMethod('Chloride in groundwater by IC', {
            criteria,
            settings: { checkTolerancePct: 5 },
            changeSummary: 'Proposal for the new client.',
          }),
        )
        .expect(201);
      expect(res.body.versions[0]).toMatchObject({
        status: 'draft',
        criteria,
        changeSummary: 'Proposal for the new client.',
        createdBy: { name: 'Alma Ruiz' },
      });
      expect(res.body.versions[0].settings).toEqual({
        requiresQualityRelease: true,
        checkTolerancePct: 5,
        onePointMaxInterceptPct: 5,
        recoveryEquivalenceMarginPct: 5,
      });
    });

    it('should answer missing and malformed fields with 422 and one message per field, saving nothing', async () => {
      const headers = await auth(DEMO.quality);
      const before = (await rows('SELECT COUNT(*) AS n FROM methods'))[0].n;
      const missing = await t.http().post('/api/methods').set(headers).send({}).expect(422);
      expect(missing.body.errors.map((e: Row) => e.field).sort()).toEqual([
        'analyte',
        'matrix',
        'name',
        'purpose',
        'technique',
        'xUnit',
        'yUnit',
      ]);
      const badPurpose = await t
        .http()
        .post('/api/methods')
        .set(headers)
        .send(newMethod('Bad purpose', { purpose: 'miracle' }))
        .expect(422);
      expect(badPurpose.body.errors).toEqual([
        expect.objectContaining({ field: 'purpose', message: expect.stringMatching(/Choose a purpose/) }),
      ]);
      const badCriteria = await t
        .http()
        .post('/api/methods')
        .set(headers)
        .send(
          newMethod('Bad criteria', {
            criteria: [
              { figure: 'calibration.r2', op: 'between', value: 0.99 },
              { figure: 'the moon', op: '>=', value: 1 },
              { figure: 'precision.rsdR', op: '~', value: 2 },
            ],
          }),
        )
        .expect(422);
      expect(badCriteria.body.errors.map((e: Row) => e.field)).toEqual(['criteria[0].value', 'criteria[1].figure', 'criteria[2].op']);
      expect(badCriteria.body.errors[0].message).toMatch(/\[low, high\]/);
      const tooLong = await t
        .http()
        .post('/api/methods')
        .set(headers)
        .send(newMethod('x'.repeat(161)))
        .expect(422);
      expect(tooLong.body.errors[0]).toMatchObject({ field: 'name', code: 'maxLength' });
      await t
        .http()
        .post('/api/methods')
        .set(headers)
        .send(newMethod('Extra field', { secret: true }))
        .expect(422);
      expect((await rows('SELECT COUNT(*) AS n FROM methods'))[0].n).toBe(before);
    });

    it('should refuse a name already taken (in any letter case) with 409 on the name field', async () => {
      const res = await t
        .http()
        .post('/api/methods')
        .set(await signedIn(t, DEMO.admin))
        .send(newMethod(NITRATE.toUpperCase()))
        .expect(409);
      expect(res.body).toMatchObject({ statusCode: 409, errors: [{ field: 'name', code: 'exists', message: expect.any(String) }] });
      expect(await rows('SELECT id FROM methods WHERE UPPER(name) = ?', NITRATE.toUpperCase())).toHaveLength(1);
    });
  });

  describe('versions', () => {
    let methodId: string;
    let firstVersionId: string;

    beforeAll(async () => {
      const res = await t
        .http()
        .post('/api/methods')
        .set(await signedIn(t, DEMO.quality))
        .send(newMethod('Fluoride in drinking water by IC'))
        .expect(201);
      methodId = res.body.id;
      firstVersionId = res.body.versions[0].id;
    });

    it('should add a draft version numbered after the highest, copying criteria and settings, and leave earlier versions alone', async () => {
      const headers = await signedIn(t, DEMO.quality);
      const first = (await t.http().get(`/api/method-versions/${firstVersionId}`).set(headers)).body;
      const res = await t
        .http()
        .post(`/api/methods/${methodId}/versions`)
        .set(headers)
        .send({ changeSummary: 'Second column in series.', changeKind: 'column-or-consumable' })
        .expect(201);
      expect(res.body).toMatchObject({
        number: 2,
        status: 'draft',
        criteria: first.criteria,
        settings: first.settings,
        method: { id: methodId },
      });
      const criteria = [{ figure: 'lackOfFit.p', op: '>=', value: 0.05 }];
      const third = await t
        .http()
        .post(`/api/methods/${methodId}/versions`)
        .set(await signedIn(t, DEMO.analyst))
        .send({ changeSummary: 'Analyst proposal.', changeKind: 'criteria', criteria })
        .expect(201);
      expect(third.body).toMatchObject({ number: 3, status: 'draft', criteria, createdBy: { name: 'Alma Ruiz' } });
      expect((await t.http().get(`/api/method-versions/${firstVersionId}`).set(headers)).body).toEqual(first);
    });

    it('should refuse new versions without a change summary (422), from reviewers (403), anonymously (401) and for unknown methods (404)', async () => {
      const missing = await t
        .http()
        .post(`/api/methods/${methodId}/versions`)
        .set(await signedIn(t, DEMO.quality))
        .send({})
        .expect(422);
      expect(missing.body.errors).toEqual([
        expect.objectContaining({ field: 'changeSummary' }),
        expect.objectContaining({ field: 'changeKind' }),
      ]);
      await t
        .http()
        .post(`/api/methods/${methodId}/versions`)
        .set(await signedIn(t, DEMO.reviewer))
        .send({ changeSummary: 'x', changeKind: 'other' })
        .expect(403);
      await t.http().post(`/api/methods/${methodId}/versions`).send({ changeSummary: 'x', changeKind: 'other' }).expect(401);
      await t
        .http()
        .post(`/api/methods/${UNKNOWN_ID}/versions`)
        .set(await signedIn(t, DEMO.quality))
        .send({ changeSummary: 'x', changeKind: 'other' })
        .expect(404);
      expect((await rows('SELECT number FROM method_versions WHERE method_id = ? ORDER BY number', methodId)).map((r) => r.number)).toEqual(
        [1, 2, 3],
      );
    });

    it('should change a draft’s criteria and record the change, old and new, in the audit trail', async () => {
      const headers = await signedIn(t, DEMO.quality);
      const before = (await t.http().get(`/api/method-versions/${firstVersionId}`).set(headers)).body;
      const criteria = [...before.criteria, { figure: 'detection.epaMdl.mdl', op: '<=', value: 0.05, label: 'MDL at most 0.05 mg/L' }];
      const res = await t
        .http()
        .patch(`/api/method-versions/${firstVersionId}`)
        .set(headers)
        .send({ lockVersion: before.lockVersion, criteria })
        .expect(200);
      expect(res.body).toMatchObject({ criteria, lockVersion: before.lockVersion + 1, status: 'draft' });
      const [entry] = await rows(
        `SELECT changes FROM audit_entries WHERE entity_id = ? AND action = 'method-version.criteria-changed'`,
        firstVersionId,
      );
      expect(JSON.parse(entry.changes as string)).toEqual({ criteria: { from: before.criteria, to: criteria } });
    });

    it('should refuse a stale lockVersion with 409 and let exactly one of two simultaneous edits win', async () => {
      const headers = await signedIn(t, DEMO.quality);
      const { lockVersion } = (await t.http().get(`/api/method-versions/${firstVersionId}`).set(headers)).body;
      await t
        .http()
        .patch(`/api/method-versions/${firstVersionId}`)
        .set(headers)
        .send({ lockVersion: lockVersion - 1, changeSummary: 'Stale.' })
        .expect(409);
      const [a, b] = await Promise.all([
        t.http().patch(`/api/method-versions/${firstVersionId}`).set(headers).send({ lockVersion, changeSummary: 'Edit A.' }),
        t.http().patch(`/api/method-versions/${firstVersionId}`).set(headers).send({ lockVersion, changeSummary: 'Edit B.' }),
      ]);
      expect([a.status, b.status].sort()).toEqual([200, 409]);
      const winner = a.status === 200 ? 'Edit A.' : 'Edit B.';
      expect((await rows('SELECT change_summary, lock_version FROM method_versions WHERE id = ?', firstVersionId))[0]).toEqual({
        change_summary: winner,
        lock_version: lockVersion + 1,
      });
    });

    it('should let an analyst edit only drafts they proposed and never change a status', async () => {
      const analyst = await signedIn(t, DEMO.analyst);
      const versions = (await t.http().get(`/api/methods/${methodId}`).set(analyst)).body.versions;
      const own = versions.find((v: Row) => v.number === 3);
      const others = versions.find((v: Row) => v.number === 2);
      await t
        .http()
        .patch(`/api/method-versions/${own.id}`)
        .set(analyst)
        .send({ lockVersion: own.lockVersion, changeSummary: 'Analyst proposal, reworded.' })
        .expect(200);
      await t
        .http()
        .patch(`/api/method-versions/${others.id}`)
        .set(analyst)
        .send({ lockVersion: others.lockVersion, changeSummary: 'Not mine.' })
        .expect(403);
      const status = await t
        .http()
        .patch(`/api/method-versions/${own.id}`)
        .set(analyst)
        .send({ lockVersion: own.lockVersion + 1, status: 'active' })
        .expect(403);
      expect(status.body.message).toMatch(/quality managers and administrators/);
      await t
        .http()
        .patch(`/api/method-versions/${own.id}`)
        .set(await signedIn(t, DEMO.reviewer))
        .send({ lockVersion: own.lockVersion + 1, changeSummary: 'x' })
        .expect(403);
      expect((await rows('SELECT status, change_summary FROM method_versions WHERE id = ?', own.id))[0]).toEqual({
        status: 'draft',
        change_summary: 'Analyst proposal, reworded.',
      });
    });

    it('should activate a draft, retire the previously active version, freeze both and never bring a retired version back', async () => {
      const headers = await signedIn(t, DEMO.quality);
      const version = (id: string) =>
        t
          .http()
          .get(`/api/method-versions/${id}`)
          .set(headers)
          .then((res) => res.body);
      const v1 = await version(firstVersionId);
      await t
        .http()
        .patch(`/api/method-versions/${firstVersionId}`)
        .set(headers)
        .send({ lockVersion: v1.lockVersion, status: 'active' })
        .expect(200);
      const v2 = (await t.http().get(`/api/methods/${methodId}`).set(headers)).body.versions[1];
      const activated = await t
        .http()
        .patch(`/api/method-versions/${v2.id}`)
        .set(headers)
        .send({ lockVersion: v2.lockVersion, status: 'active' })
        .expect(200);
      expect(activated.body.status).toBe('active');
      const retired = await version(firstVersionId);
      expect(retired.status).toBe('retired');

      const frozen = await t
        .http()
        .patch(`/api/method-versions/${v2.id}`)
        .set(headers)
        .send({ lockVersion: activated.body.lockVersion, changeSummary: 'Sneaky change.' })
        .expect(409);
      expect(frozen.body.message).toBe('An active version is frozen; create a new version.');
      const back = await t
        .http()
        .patch(`/api/method-versions/${firstVersionId}`)
        .set(headers)
        .send({ lockVersion: retired.lockVersion, status: 'active' })
        .expect(409);
      expect(back.body.message).toMatch(/never comes back/);
      const skip = await t
        .http()
        .patch(`/api/method-versions/${v2.id}`)
        .set(headers)
        .send({ lockVersion: activated.body.lockVersion, status: 'draft' })
        .expect(409);
      expect(skip.body.errors[0].field).toBe('status');
      expect(await rows('SELECT number, status FROM method_versions WHERE method_id = ? ORDER BY number', methodId)).toEqual([
        { number: 1, status: 'retired' },
        { number: 2, status: 'active' },
        { number: 3, status: 'draft' },
      ]);
      const actions = (
        await rows(
          `SELECT action FROM audit_entries WHERE entity = 'method-version' AND entity_id IN (?, ?) ORDER BY seq`,
          firstVersionId,
          v2.id,
        )
      ).map((r) => r.action);
      expect(actions).toEqual(expect.arrayContaining(['method-version.activated', 'method-version.retired']));
    });

    it('should answer 422 without a lockVersion, 404 for an unknown version and 401 anonymously', async () => {
      const headers = await signedIn(t, DEMO.quality);
      const res = await t.http().patch(`/api/method-versions/${firstVersionId}`).set(headers).send({ changeSummary: 'x' }).expect(422);
      expect(res.body.errors[0]).toMatchObject({ field: 'lockVersion', message: 'Send the lockVersion you read.' });
      await t.http().patch(`/api/method-versions/${firstVersionId}`).set(headers).send({ lockVersion: 1, status: 'archived' }).expect(422);
      await t.http().patch(`/api/method-versions/${UNKNOWN_ID}`).set(headers).send({ lockVersion: 1, changeSummary: 'x' }).expect(404);
      await t.http().patch(`/api/method-versions/${firstVersionId}`).send({ lockVersion: 1, changeSummary: 'x' }).expect(401);
    });
  });
});
