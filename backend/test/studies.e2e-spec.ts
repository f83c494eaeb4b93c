import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { canonicalJson, ENGINE_VERSION } from '@meritline/shared';
import { DEMO_STUDIES } from '../src/database/seeds/demo-studies.seed.js';
import { listMethods, signedIn } from './support/flows.js';
import { queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

type Row = Record<string, unknown>;

/* eslint-disable @typescript-eslint/no-explicit-any -- reference files are plain JSON */
const reference = (name: string): any => JSON.parse(readFileSync(new URL(`../../reference-checks/data/${name}`, import.meta.url), 'utf8'));
// Miller & Miller, Statistics and Chemometrics for Analytical Chemistry: fluorescence calibration (7 standards).
const miller = reference('calibration_miller_fluorescence.json');
// NIST StRD one-way ANOVA "SiRstv": 5 instruments × 5 replicates (certified mean squares).
const sirstv = reference('nist_strd_anova_sirstv.json');
// Spike-recovery worked example with its recomputed mean (own synthetic numbers, see the file).
const spike = reference('recovery_examples.json').spike_recovery;
/* eslint-enable @typescript-eslint/no-explicit-any */

const CLI = fileURLToPath(new URL('../../shared/dist/cli.js', import.meta.url));
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

function completeData() {
  return {
    standards: (miller.data.x as number[]).map((x, i) => ({ x, y: miller.data.y[i] as number })),
    blanks: [2.0, 2.2, 1.9, 2.1, 2.3],
    recovery: (spike.c_spiked as number[]).map((found, i) => ({
      id: `R${i + 1}`,
      level: 'mid',
      added: spike.c_added,
      found,
      native: spike.c_unspiked,
    })),
    precision: (sirstv.data.group as number[]).map((group, i) => ({ group: `instrument ${group}`, value: sirstv.data.value[i] as number })),
    unknowns: [{ id: 'U-1', y: [13.5] }],
  };
}

describe('validation studies', () => {
  let t: TestApp;
  const versions: Record<string, string> = {};
  const seeded: Record<string, Row> = {};
  const auth = async (email: string) => ({ Authorization: `Bearer ${await t.tokenFor(email)}` });
  const rows = (sql: string, ...params: unknown[]) => queryDatabase(t, sql, ...params);
  const stored = async (id: string) =>
    (await rows('SELECT data, data_hash, lock_version, title, status, editor_ids FROM validation_studies WHERE id = ?', id))[0];
  const studyCount = async () => (await rows('SELECT COUNT(*) AS n FROM validation_studies'))[0].n;
  const create = async (body: Row, status = 201) =>
    t
      .http()
      .post('/api/studies')
      .set(await signedIn(t, DEMO.analyst))
      .send(body)
      .expect(status);

  beforeAll(async () => {
    t = await createTestApp();
    const methods = await listMethods(t, DEMO.analyst);
    for (const method of methods)
      for (const version of method.versions) versions[`${method.analyte.split(' ')[0].toLowerCase()} v${version.number}`] = version.id;
    const page = (
      await t
        .http()
        .get('/api/studies?pageSize=100')
        .set(await signedIn(t, DEMO.analyst))
    ).body;
    for (const study of page.items) seeded[study.title] = study;
  });
  afterAll(() => t.close());

  describe('GET /api/studies', () => {
    it('should refuse anonymous callers and list the demo studies for every role, without data and result but with the verdict', async () => {
      await t.http().get('/api/studies').expect(401);
      const res = await t
        .http()
        .get('/api/studies')
        .set(await signedIn(t, DEMO.reviewer))
        .expect(200);
      expect(res.body).toMatchObject({ total: 10, totalIsCapped: false, pageSize: 20, nextCursor: null, prevCursor: null });
      expect(res.body.items.map((s: Row) => s.title).sort()).toEqual(Object.values(DEMO_STUDIES).sort());
      for (const item of res.body.items) {
        expect(item).not.toHaveProperty('data');
        expect(item).not.toHaveProperty('result');
        expect(item).toMatchObject({
          method: { name: expect.any(String), xUnit: expect.any(String) },
          methodVersion: { number: expect.any(Number) },
          author: { name: expect.any(String) },
        });
      }
      const byTitle = (title: string) => res.body.items.find((s: Row) => s.title === title);
      expect(byTitle(DEMO_STUDIES.dyeSubmitted)).toMatchObject({ status: 'submitted', verdictPass: true, author: { name: 'Alma Ruiz' } });
      expect(byTitle(DEMO_STUDIES.nitrateApproved)).toMatchObject({
        status: 'approved',
        verdictPass: true,
        methodVersion: { number: 2, status: 'active' },
      });
      expect(byTitle(DEMO_STUDIES.pesticideReturned)).toMatchObject({ status: 'returned', author: { name: 'Tomasz Weber' } });
      expect(byTitle(DEMO_STUDIES.pesticideDraft)).toMatchObject({ status: 'draft', verdictPass: false });
    });

    it('should page and sort on the server', async () => {
      const headers = await signedIn(t, DEMO.reviewer);
      const titles = (await t.http().get('/api/studies?sort=title&order=asc&pageSize=100').set(headers).expect(200)).body.items.map(
        (s: Row) => s.title,
      );
      expect(titles).toEqual([...Object.values(DEMO_STUDIES)].sort((a, b) => (a < b ? -1 : 1)));
      const first = await t.http().get('/api/studies?sort=title&order=asc&pageSize=2').set(headers).expect(200);
      expect(first.body).toMatchObject({ total: 10, pageSize: 2, prevCursor: null });
      const second = await t
        .http()
        .get('/api/studies')
        .query({ sort: 'title', order: 'asc', pageSize: 2, cursor: first.body.nextCursor })
        .set(headers)
        .expect(200);
      expect(second.body.items.map((s: Row) => s.title)).toEqual(titles.slice(2, 4));
      const byCreation = (await t.http().get('/api/studies?sort=createdAt&order=desc').set(headers)).body.items.map(
        (s: Row) => s.createdAt,
      );
      expect(byCreation).toEqual([...byCreation].sort().reverse());
      const byUpdate = (await t.http().get('/api/studies').set(headers)).body.items.map((s: Row) => s.updatedAt);
      expect(byUpdate).toEqual([...byUpdate].sort().reverse());
    });

    it('should walk every sort forward and back by cursor without duplicates or gaps, filters kept', async () => {
      const headers = await auth(DEMO.analyst);
      const list = async (query: Record<string, unknown>) =>
        (await t.http().get('/api/studies').query(query).set(headers).expect(200)).body as {
          items: { id: string }[];
          nextCursor: string | null;
          prevCursor: string | null;
        };
      for (const sort of ['updatedAt', 'createdAt', 'title', 'status'])
        for (const order of ['asc', 'desc'])
          for (const filter of [{}, { status: 'draft' }, { q: 'nitrate' }] as Record<string, string>[]) {
            const base = { sort, order, ...filter };
            const whole = (await list({ ...base, pageSize: 100 })).items.map((s) => s.id);
            const pages: string[][] = [];
            let page = await list({ ...base, pageSize: 3 });
            pages.push(page.items.map((s) => s.id));
            while (page.nextCursor) {
              page = await list({ ...base, pageSize: 3, cursor: page.nextCursor });
              pages.push(page.items.map((s) => s.id));
            }
            expect(pages.flat(), `${sort} ${order} ${JSON.stringify(filter)}`).toEqual(whole);
            expect(pages.every((ids) => ids.length > 0 && ids.length <= 3)).toBe(true);
            const back: string[][] = [page.items.map((s) => s.id)];
            while (page.prevCursor) {
              page = await list({ ...base, pageSize: 3, cursor: page.prevCursor });
              back.unshift(page.items.map((s) => s.id));
            }
            expect(back).toEqual(pages);
          }
    });

    it('should refuse a cursor it cannot read, one made for another sort and one whose row is gone, naming the cursor', async () => {
      const headers = await auth(DEMO.analyst);
      const { nextCursor } = (await t.http().get('/api/studies?pageSize=2').set(headers).expect(200)).body;
      const gone = Buffer.from(JSON.stringify(['00000000-0000-4000-8000-000000000000', 'after', 'updatedAt', 'desc'])).toString(
        'base64url',
      );
      for (const query of [
        { cursor: 'not-a-cursor' },
        { cursor: Buffer.from('{"id":1}').toString('base64url') },
        { cursor: nextCursor, sort: 'title' },
        { cursor: nextCursor, order: 'asc' },
        { cursor: gone },
        { cursor: 'x'.repeat(401) },
      ]) {
        const res = await t.http().get('/api/studies').query(query).set(headers).expect(422);
        expect(res.body.errors[0].field).toBe('cursor');
      }
    });

    it('should filter by status, method, version, author, mine, title text and date range', async () => {
      const analyst = await signedIn(t, DEMO.analyst);
      const count = async (query: string) => (await t.http().get(`/api/studies?${query}`).set(analyst).expect(200)).body.total;
      expect(await count('status=draft')).toBe(3);
      expect(await count(`methodVersionId=${versions['nitrate v2']}`)).toBe(2);
      const nitrate = (await t.http().get(`/api/method-versions/${versions['nitrate v2']}`).set(analyst)).body.method.id;
      expect(await count(`methodId=${nitrate}`)).toBe(3);
      expect(await count('mine=true')).toBe(6);
      const tomasz = (seeded[DEMO_STUDIES.pesticideReturned].author as Row).id;
      expect(await count(`authorId=${tomasz}`)).toBe(4);
      expect(await count('q=NITRATE')).toBe(3);
      expect(await count('q=%25')).toBe(0);
      expect(await count('status=draft&mine=true')).toBe(2);
      const all = (await t.http().get('/api/studies?pageSize=100').set(analyst)).body.items as { updatedAt: string }[];
      const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
      expect(await count(`from=${day(-3)}`)).toBe(all.filter((s) => s.updatedAt.slice(0, 10) >= day(-3)).length);
      expect(await count(`to=${day(-3)}`)).toBe(all.filter((s) => s.updatedAt.slice(0, 10) <= day(-3)).length);
      expect(await count(`from=${day(1)}`)).toBe(0);
    });

    it('should answer bad query parameters with 422 naming the parameter', async () => {
      const headers = await signedIn(t, DEMO.analyst);
      for (const [query, field] of [
        ['pageSize=101', 'pageSize'],
        ['pageSize=0', 'pageSize'],
        ['page=2', 'page'],
        ['sort=author', 'sort'],
        ['order=up', 'order'],
        ['status=lost', 'status'],
        ['mine=maybe', 'mine'],
        ['from=yesterday', 'from'],
        ['methodId=42', 'methodId'],
      ]) {
        const res = await t.http().get(`/api/studies?${query}`).set(headers).expect(422);
        expect(res.body.errors[0].field).toBe(field);
      }
      await t.http().get('/api/studies?colour=red').set(headers).expect(422);
    });
  });

  describe('POST /api/studies', () => {
    it('should refuse anonymous callers (401) and every role but analyst (403), saving nothing', async () => {
      const body = { methodVersionId: versions['tartrazine v1'], title: 'Refused', data: completeData() };
      await t.http().post('/api/studies').send(body).expect(401);
      for (const email of [DEMO.reviewer, DEMO.quality, DEMO.admin])
        await t
          .http()
          .post('/api/studies')
          .set(await signedIn(t, email))
          .send(body)
          .expect(403);
      expect(await studyCount()).toBe(10);
    });

    it('should refuse a retired or unknown method version with 422 on methodVersionId', async () => {
      const retired = await create({ methodVersionId: versions['nitrate v1'], title: 'On the old column', data: completeData() }, 422);
      expect(retired.body.errors).toEqual([
        { field: 'methodVersionId', code: 'retired', message: expect.stringMatching(/retired; choose its current version/) },
      ]);
      const unknown = await create({ methodVersionId: UNKNOWN_ID, title: 'Nowhere', data: completeData() }, 422);
      expect(unknown.body.errors[0]).toMatchObject({ field: 'methodVersionId', code: 'not_found' });
      expect(await studyCount()).toBe(10);
    });

    it('should answer missing fields, bad meta and malformed study data with 422 field messages, saving nothing', async () => {
      const missing = await create({}, 422);
      expect(missing.body.errors.map((e: Row) => e.field).sort()).toEqual(['data', 'methodVersionId', 'title']);
      const badDate = await create(
        { methodVersionId: versions['tartrazine v1'], title: 'Dates', data: {}, meta: { startedOn: 'last Tuesday' } },
        422,
      );
      expect(badDate.body.errors[0]).toMatchObject({ field: 'meta.startedOn', message: 'Give the date as YYYY-MM-DD.' });
      const backwards = await create(
        {
          methodVersionId: versions['tartrazine v1'],
          title: 'Dates',
          data: {},
          meta: { startedOn: '2026-11-10', finishedOn: '2026-11-02' },
        },
        422,
      );
      expect(backwards.body.errors[0].field).toBe('meta.finishedOn');

      const data = completeData();
      (data.standards[1] as Row).y = 'five';
      (data.recovery[0] as Row).added = -1;
      const malformed = await create(
        { methodVersionId: versions['tartrazine v1'], title: 'Malformed', data: { ...data, model: 'cubic-spline' } },
        422,
      );
      expect(malformed.body.errors).toEqual(
        expect.arrayContaining([
          expect.objectContaining({ field: 'model', code: 'invalid_value' }),
          expect.objectContaining({ field: 'standards[1].y', code: 'not_number' }),
          expect.objectContaining({ field: 'recovery[0].added', code: 'not_positive' }),
        ]),
      );
      expect(await studyCount()).toBe(10);
    });

    it('should keep an incomplete draft with no result and the engine’s reasons', async () => {
      const res = await create(
        {
          methodVersionId: versions['tartrazine v1'],
          title: 'Just started',
          data: {
            standards: [
              { x: 1, y: 0.052 },
              { x: 2, y: 0.103 },
            ],
          },
        },
        201,
      );
      expect(res.body).toMatchObject({
        status: 'draft',
        result: null,
        resultErrors: [{ field: 'standards', code: 'too_few', message: expect.any(String) }],
        lockVersion: 1,
        engineVersion: ENGINE_VERSION,
      });
      expect(res.body.data.units).toEqual({ x: 'mg/L', y: 'AU' });
    });

    it('should store the server’s result, the engine version and the hash, with the method version’s criteria', async () => {
      const data = { ...completeData(), criteria: [{ figure: 'calibration.r2', op: '>=', value: 0.1 }] };
      const res = await create(
        {
          methodVersionId: versions['tartrazine v1'],
          title: 'Fluorescein check',
          data,
          meta: { instrument: 'Fluorimeter 2', startedOn: '2026-11-02' },
        },
        201,
      );
      const version = (
        await t
          .http()
          .get(`/api/method-versions/${versions['tartrazine v1']}`)
          .set(await signedIn(t, DEMO.analyst))
      ).body;
      const analyst = (
        await t
          .http()
          .get('/api/auth/me')
          .set(await signedIn(t, DEMO.analyst))
      ).body;
      expect(res.body).toMatchObject({
        title: 'Fluorescein check',
        status: 'draft',
        methodVersionId: versions['tartrazine v1'],
        method: { name: 'Tartrazine in soft drinks by UV-Vis spectrophotometry', xUnit: 'mg/L', yUnit: 'AU' },
        methodVersion: { number: 1, status: 'active', criteria: version.criteria },
        meta: { instrument: 'Fluorimeter 2', startedOn: '2026-11-02' },
        author: { id: analyst.id, name: 'Alma Ruiz' },
        editorIds: [analyst.id],
        copiedFromId: null,
        resultErrors: null,
        submittedAt: null,
        approvedAt: null,
        engineVersion: ENGINE_VERSION,
      });
      expect(res.body.data.criteria).toEqual(version.criteria.map(({ figure, op, value }: Row) => ({ figure, op, value })));
      expect(res.body.dataHash).toBe(createHash('sha256').update(canonicalJson(res.body.data)).digest('hex'));
      expect(res.body.result.verdict.criteria.map((c: Row) => c.figure)).toEqual(version.criteria.map((c: Row) => c.figure));
      // Miller & Miller fluorescence example: b = 1.9304, a = 1.5179 (values recomputed in the reference file).
      expect(res.body.result.calibration.slope).toBeCloseTo(miller.computed.slope_b, 10);
      expect(res.body.result.calibration.intercept).toBeCloseTo(miller.computed.intercept_a, 10);
      // NIST StRD SiRstv: certified within-instrument mean square 1.08318280000000E-02.
      expect(res.body.result.precision.msWithin).toBeCloseTo(Number(sirstv.certified.within.ms), 12);
      // Spike-recovery worked example: mean recovery 98.767 %.
      expect(res.body.result.recovery.overall.meanPct).toBeCloseTo(spike.mean_recovery_pct, 10);
      expect(Object.keys(res.body).sort()).toEqual(
        [
          'approvedAt',
          'author',
          'copiedFromId',
          'createdAt',
          'data',
          'dataHash',
          'editorIds',
          'engineVersion',
          'id',
          'lockVersion',
          'meta',
          'method',
          'methodVersion',
          'methodVersionId',
          'result',
          'resultErrors',
          'status',
          'submittedAt',
          'title',
          'updatedAt',
        ].sort(),
      );
      const audit = await rows(`SELECT action FROM audit_entries WHERE entity_id = ?`, res.body.id);
      expect(audit.map((entry) => entry.action)).toEqual(['study.created']);
    });

    it('should return from GET exactly the result the command-line engine prints for the stored data', async () => {
      const created = (
        await create({
          methodVersionId: versions['chlorpyrifos v1'],
          title: 'CLI parity',
          data: { ...completeData(), weighting: '1/x', standards: completeData().standards.slice(1) },
        })
      ).body;
      for (const id of [created.id, seeded[DEMO_STUDIES.pesticideReturned].id, seeded[DEMO_STUDIES.nitrateApproved].id]) {
        const study = (
          await t
            .http()
            .get(`/api/studies/${id}`)
            .set(await signedIn(t, DEMO.reviewer))
            .expect(200)
        ).body;
        const dir = mkdtempSync(join(tmpdir(), 'meritline-cli-'));
        try {
          writeFileSync(join(dir, 'study.json'), JSON.stringify(study.data));
          const printed = JSON.parse(execFileSync(process.execPath, [CLI, join(dir, 'study.json')], { encoding: 'utf8' }));
          expect(study.result).toEqual(printed);
        } finally {
          rmSync(dir, { recursive: true, force: true });
        }
      }
    });
  });

  describe('GET /api/studies/:id', () => {
    it('should answer 401 anonymously, 404 for an unknown id and 400 for a malformed one', async () => {
      const id = seeded[DEMO_STUDIES.dyeSubmitted].id;
      await t.http().get(`/api/studies/${id}`).expect(401);
      await t
        .http()
        .get(`/api/studies/${UNKNOWN_ID}`)
        .set(await signedIn(t, DEMO.reviewer))
        .expect(404);
      await t
        .http()
        .get('/api/studies/42')
        .set(await signedIn(t, DEMO.reviewer))
        .expect(400);
    });
  });

  describe('PATCH /api/studies/:id', () => {
    let studyId: string;

    beforeAll(async () => {
      studyId = (await create({ methodVersionId: versions['tartrazine v1'], title: 'Editable study', data: completeData() })).body.id;
    });

    it('should let the author change the title and meta without touching the data', async () => {
      const before = await stored(studyId);
      const res = await t
        .http()
        .patch(`/api/studies/${studyId}`)
        .set(await signedIn(t, DEMO.analyst))
        .send({ lockVersion: 1, title: 'Editable study, renamed', meta: { conclusion: 'Pending.' } })
        .expect(200);
      expect(res.body).toMatchObject({
        title: 'Editable study, renamed',
        lockVersion: 2,
        meta: { conclusion: 'Pending.' },
        dataHash: before.data_hash,
      });
      const [entry] = await rows(`SELECT changes FROM audit_entries WHERE entity_id = ? AND action = 'study.updated'`, studyId);
      expect(JSON.parse(entry.changes as string).title).toEqual({ from: 'Editable study', to: 'Editable study, renamed' });
    });

    it('should refuse anonymous callers (401), other roles (403) and another analyst (403), saving nothing', async () => {
      const before = await stored(studyId);
      await t.http().patch(`/api/studies/${studyId}`).send({ lockVersion: 2, title: 'x' }).expect(401);
      await t
        .http()
        .patch(`/api/studies/${studyId}`)
        .set(await signedIn(t, DEMO.reviewer))
        .send({ lockVersion: 2, title: 'x' })
        .expect(403);
      const other = await t
        .http()
        .patch(`/api/studies/${studyId}`)
        .set(await signedIn(t, DEMO.analyst2))
        .send({ lockVersion: 2, title: 'Mine now' })
        .expect(403);
      expect(other.body.message).toBe('Only the author of a study may change it.');
      expect(await stored(studyId)).toEqual(before);
    });

    it('should answer 409 for a submitted or approved study, 409 for a stale lockVersion, 422 without one and 404 for an unknown id', async () => {
      const alma = await signedIn(t, DEMO.analyst);
      const submitted = await t
        .http()
        .patch(`/api/studies/${seeded[DEMO_STUDIES.dyeSubmitted].id}`)
        .set(alma)
        .send({ lockVersion: seeded[DEMO_STUDIES.dyeSubmitted].lockVersion, title: 'x' })
        .expect(409);
      expect(submitted.body.message).toMatch(/locked/);
      await t
        .http()
        .patch(`/api/studies/${seeded[DEMO_STUDIES.nitrateApproved].id}`)
        .set(alma)
        .send({ lockVersion: seeded[DEMO_STUDIES.nitrateApproved].lockVersion, title: 'x' })
        .expect(409);
      await t.http().patch(`/api/studies/${studyId}`).set(alma).send({ lockVersion: 1, title: 'Stale' }).expect(409);
      const missing = await t.http().patch(`/api/studies/${studyId}`).set(alma).send({ title: 'No lock' }).expect(422);
      expect(missing.body.errors[0].field).toBe('lockVersion');
      await t.http().patch(`/api/studies/${UNKNOWN_ID}`).set(alma).send({ lockVersion: 1, title: 'x' }).expect(404);
      expect((await stored(studyId)).title).toBe('Editable study, renamed');
      expect((await rows('SELECT title FROM validation_studies WHERE id = ?', seeded[DEMO_STUDIES.dyeSubmitted].id))[0].title).toBe(
        DEMO_STUDIES.dyeSubmitted,
      );
    });

    it('should let exactly one of two simultaneous data edits win and store the winner’s data and result', async () => {
      const alma = await auth(DEMO.analyst);
      const { lock_version: lockVersion } = await stored(studyId);
      const edit = (blank: number) => ({ ...completeData(), blanks: [blank, blank + 0.1, blank + 0.2] });
      const [a, b] = await Promise.all([
        t
          .http()
          .patch(`/api/studies/${studyId}`)
          .set(alma)
          .send({ lockVersion, data: edit(1) }),
        t
          .http()
          .patch(`/api/studies/${studyId}`)
          .set(alma)
          .send({ lockVersion, data: edit(5) }),
      ]);
      expect([a.status, b.status].sort()).toEqual([200, 409]);
      const winner = a.status === 200 ? a.body : b.body;
      const row = await stored(studyId);
      expect(row.lock_version).toBe((lockVersion as number) + 1);
      expect(JSON.parse(row.data as string).blanks).toEqual(winner.data.blanks);
      expect(row.data_hash).toBe(createHash('sha256').update(canonicalJson(winner.data)).digest('hex'));
      expect(winner.result.detection.blankSd.n).toBe(3);
    });

    it('should answer malformed data with the engine’s field errors and keep the stored study as it was', async () => {
      const before = await stored(studyId);
      const data = completeData();
      (data.standards[0] as Row).excluded = { reason: '' };
      const res = await t
        .http()
        .patch(`/api/studies/${studyId}`)
        .set(await signedIn(t, DEMO.analyst))
        .send({ lockVersion: before.lock_version, data })
        .expect(422);
      expect(res.body.errors).toEqual([expect.objectContaining({ field: 'standards[0].excluded.reason' })]);
      expect(await stored(studyId)).toEqual(before);
    });

    it('should record each newly excluded standard with its reason and each re-included one', async () => {
      const alma = await signedIn(t, DEMO.analyst);
      const current = (await t.http().get(`/api/studies/${studyId}`).set(alma)).body;
      const data = structuredClone(current.data);
      data.standards[2].excluded = { reason: 'Cuvette scratched.' };
      data.standards[4].excluded = { reason: 'Pipetting error noted in the logbook.' };
      const excluded = await t
        .http()
        .patch(`/api/studies/${studyId}`)
        .set(alma)
        .send({ lockVersion: current.lockVersion, data })
        .expect(200);
      expect(excluded.body.result.calibration.excluded.map((e: Row) => e.index)).toEqual([2, 4]);
      delete data.standards[2].excluded;
      await t.http().patch(`/api/studies/${studyId}`).set(alma).send({ lockVersion: excluded.body.lockVersion, data }).expect(200);
      const entries = await rows(
        `SELECT action, reason, changes FROM audit_entries WHERE entity_id = ? AND action LIKE 'study.point-%' ORDER BY seq`,
        studyId,
      );
      expect(entries.map((e) => [e.action, e.reason])).toEqual([
        ['study.point-excluded', 'Cuvette scratched.'],
        ['study.point-excluded', 'Pipetting error noted in the logbook.'],
        ['study.point-included', null],
      ]);
      expect(Object.keys(JSON.parse(entries[2].changes as string))).toEqual(['standards[2].excluded']);
    });

    it('should keep a draft whose data become incomplete, with no result and the reasons', async () => {
      const alma = await auth(DEMO.analyst);
      const { lock_version: lockVersion } = await stored(studyId);
      const res = await t
        .http()
        .patch(`/api/studies/${studyId}`)
        .set(alma)
        .send({ lockVersion, data: { standards: [{ x: 1, y: 0.05 }] } })
        .expect(200);
      expect(res.body).toMatchObject({ result: null, resultErrors: [expect.objectContaining({ field: 'standards', code: 'too_few' })] });
    });

    it('should ask for a reason before changing the data of a returned study, and add the editor', async () => {
      const tomasz = await signedIn(t, DEMO.analyst2);
      const study = (await t.http().get(`/api/studies/${seeded[DEMO_STUDIES.pesticideReturned].id}`).set(tomasz)).body;
      const before = await stored(study.id);
      const data = structuredClone(study.data);
      data.standards[0].excluded = { reason: 'Re-injected: the first injection of the lowest standard was contaminated.' };
      const refused = await t
        .http()
        .patch(`/api/studies/${study.id}`)
        .set(tomasz)
        .send({ lockVersion: study.lockVersion, data })
        .expect(422);
      expect(refused.body.errors).toEqual([
        {
          field: 'reason',
          code: 'required',
          message: 'Say why the study changes after it was returned; the reason is kept with the change.',
        },
      ]);
      expect(await stored(study.id)).toEqual(before);
      await t
        .http()
        .patch(`/api/studies/${study.id}`)
        .set(tomasz)
        .send({ lockVersion: study.lockVersion, title: `${study.title} (rev. 2)` })
        .expect(422);
      expect(await stored(study.id)).toEqual(before);
      const titleOnly = await t
        .http()
        .patch(`/api/studies/${study.id}`)
        .set(tomasz)
        .send({ lockVersion: study.lockVersion, title: `${study.title} (rev. 2)`, reason: 'Revision number in the title.' })
        .expect(200);
      const res = await t
        .http()
        .patch(`/api/studies/${study.id}`)
        .set(tomasz)
        .send({ lockVersion: titleOnly.body.lockVersion, data, reason: 'Reviewer asked to deal with the lowest standard.' })
        .expect(200);
      expect(res.body.status).toBe('returned');
      expect(res.body.editorIds).toEqual([study.author.id]);
      const [entry] = await rows(
        `SELECT reason FROM audit_entries WHERE entity_id = ? AND action = 'study.updated' ORDER BY seq DESC LIMIT 1`,
        study.id,
      );
      expect(entry.reason).toBe('Reviewer asked to deal with the lowest standard.');
    });
  });

  describe('DELETE /api/studies/:id', () => {
    it('should delete only the author’s own draft, answering 401, 403, 409 and 404 otherwise', async () => {
      const draft = (await create({ methodVersionId: versions['tartrazine v1'], title: 'To be deleted', data: completeData() })).body;
      await t.http().delete(`/api/studies/${draft.id}`).expect(401);
      await t
        .http()
        .delete(`/api/studies/${draft.id}`)
        .set(await signedIn(t, DEMO.quality))
        .expect(403);
      await t
        .http()
        .delete(`/api/studies/${draft.id}`)
        .set(await signedIn(t, DEMO.analyst2))
        .expect(403);
      await t
        .http()
        .delete(`/api/studies/${seeded[DEMO_STUDIES.dyeSubmitted].id}`)
        .set(await signedIn(t, DEMO.analyst))
        .expect(409);
      const returned = await t
        .http()
        .delete(`/api/studies/${seeded[DEMO_STUDIES.pesticideReturned].id}`)
        .set(await signedIn(t, DEMO.analyst2))
        .expect(409);
      expect(returned.body.message).toMatch(/Only a draft/);
      await t
        .http()
        .delete(`/api/studies/${UNKNOWN_ID}`)
        .set(await signedIn(t, DEMO.analyst))
        .expect(404);
      expect(await stored(draft.id)).toBeDefined();

      await t
        .http()
        .delete(`/api/studies/${draft.id}`)
        .set(await signedIn(t, DEMO.analyst))
        .expect(204);
      await t
        .http()
        .get(`/api/studies/${draft.id}`)
        .set(await signedIn(t, DEMO.analyst))
        .expect(404);
      expect((await rows(`SELECT action FROM audit_entries WHERE entity_id = ? ORDER BY seq`, draft.id)).map((e) => e.action)).toEqual([
        'study.created',
        'study.deleted',
      ]);
    });
  });
});
