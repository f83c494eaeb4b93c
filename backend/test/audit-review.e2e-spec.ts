import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuditTrailEntryDto, AuditTrailPageDto } from '@meritline/shared';
import { bearer, createStudy, userId } from './support/review-fixtures.js';
import { binary, pdfsig, scratchFolder } from './support/flows.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

const scratch = scratchFolder('meritline-audit-review-');
const saved = scratch.saved;
const pdftotext = (file: string) => execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
afterAll(scratch.remove);

const FORMULA_COMMENT = '=HYPERLINK("http://example.invalid","check the blanks")';

describe('reviewing the audit trail', () => {
  let t: TestApp;
  let as: (who: keyof typeof DEMO) => Record<string, string>;
  let ownStudy: string;
  let otherStudy: string;
  let returnedStudy: string;

  beforeAll(async () => {
    t = await createTestApp();
    const tokens = Object.fromEntries(await Promise.all(Object.entries(DEMO).map(async ([k, email]) => [k, await t.tokenFor(email)])));
    as = (who) => bearer(tokens[who] as string);
    ownStudy = (await createStudy(t, { author: DEMO.analyst })).id;
    await t.http().post(`/api/studies/${ownStudy}/submit`).set(as('analyst')).send({ password: DEMO_PASSWORD }).expect(200);
    otherStudy = (await createStudy(t, { author: DEMO.analyst2 })).id;
    await t.http().post(`/api/studies/${otherStudy}/submit`).set(as('analyst2')).send({ password: DEMO_PASSWORD }).expect(200);
    returnedStudy = (await createStudy(t, { author: DEMO.analyst2 })).id;
    await t.http().post(`/api/studies/${returnedStudy}/submit`).set(as('analyst2')).send({ password: DEMO_PASSWORD }).expect(200);
    await t.http().post(`/api/studies/${returnedStudy}/return`).set(as('reviewer')).send({ comment: FORMULA_COMMENT }).expect(200);
  });
  afterAll(() => t.close());

  const trail = async (query: string, who: keyof typeof DEMO = 'quality', status = 200) =>
    (await t.http().get(`/api/audit?${query}`).set(as(who)).expect(status)).body as AuditTrailPageDto;

  describe('who may read what', () => {
    it('should refuse anonymous callers (401)', async () => {
      await t.http().get('/api/audit').expect(401);
      await t.http().get('/api/audit/export?format=csv').expect(401);
      await t.http().get('/api/audit/reviews').expect(401);
      await t.http().post('/api/audit/reviews').send({}).expect(401);
    });

    it('should give an analyst the trail of their own study, in words', async () => {
      const page = await trail(`record=study:${ownStudy}`, 'analyst');
      expect(page.items.map((e) => e.action).sort()).toEqual(['signature.authored', 'study.submitted']);
      const submitted = page.items.find((e) => e.action === 'study.submitted') as AuditTrailEntryDto;
      expect(submitted).toMatchObject({
        actorName: 'Alma Ruiz',
        actionText: 'Study submitted for review',
        recordText: 'Validation study',
        changesInWords: [{ field: 'Status', from: 'Draft', to: 'Awaiting review' }],
      });
      expect(submitted.at).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
    });

    it('should refuse an analyst another record’s trail and the chain check (403)', async () => {
      const refused = await t.http().get(`/api/audit?record=study:${otherStudy}`).set(as('analyst')).expect(403);
      expect(refused.body.message).toMatch(/records you work on/);
      await t
        .http()
        .get(`/api/audit?record=user:${await userId(t, DEMO.quality)}`)
        .set(as('analyst'))
        .expect(403);
      await t.http().get(`/api/audit/export?format=csv&record=study:${otherStudy}`).set(as('analyst')).expect(403);
      await t.http().get('/api/audit/verify').set(as('analyst')).expect(403);
    });

    it('should limit an analyst’s unfiltered trail to their own records', async () => {
      const me = await userId(t, DEMO.analyst);
      const page = await trail('pageSize=200', 'analyst');
      expect(page.items.length).toBeGreaterThan(0);
      for (const entry of page.items) {
        expect(entry.entityId).not.toBe(otherStudy);
        if (entry.entity === 'user') expect(entry.entityId).toBe(me);
      }
      expect(page.items.some((e) => e.entityId === ownStudy)).toBe(true);
    });

    it('should name the record filtered on and list only the people of the reader’s part of the trail', async () => {
      const page = await trail(`record=study:${ownStudy}`, 'analyst');
      expect(page.record).toEqual({ kind: 'study', id: ownStudy, name: expect.any(String) });
      const quality = (await t.http().get('/api/audit/people').set(as('quality')).expect(200)).body as { id: string; name: string }[];
      expect(quality.map((p) => p.name)).toEqual(expect.arrayContaining(['Alma Ruiz', 'Tomasz Weber', 'Priya Nair']));
      const analyst = (await t.http().get('/api/audit/people').set(as('analyst')).expect(200)).body as { id: string; name: string }[];
      expect(analyst.map((p) => p.name)).toContain('Alma Ruiz');
      expect(analyst.map((p) => p.name)).not.toContain('Tomasz Weber');
    });

    it('should let a reviewer read the trail of a study awaiting review', async () => {
      const page = await trail(`record=study:${otherStudy}`, 'reviewer');
      expect(page.items.map((e) => e.action)).toContain('study.submitted');
    });

    it('should answer 404 for an unknown record and 422 for a malformed filter', async () => {
      await trail('record=study:00000000-0000-4000-8000-000000000000', 'quality', 404);
      const bad = await t.http().get('/api/audit?record=spaceship:1&pageSize=500').set(as('quality')).expect(422);
      expect(bad.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['pageSize', 'record']);
      const day = await t.http().get('/api/audit?from=2026-02-30').set(as('quality')).expect(422);
      expect(day.body.errors[0]).toMatchObject({ field: 'from', code: 'invalid_date' });
      const order = await t.http().get('/api/audit?from=2026-05-02&to=2026-05-01').set(as('quality')).expect(422);
      expect(order.body.errors[0]).toMatchObject({ field: 'to' });
      await t.http().get('/api/audit?cursor=10&page=2').set(as('quality')).expect(422);
      await t
        .http()
        .get(`/api/audit?q=${'x'.repeat(101)}`)
        .set(as('quality'))
        .expect(422);
    });
  });

  describe('filters and paging', () => {
    it('should page by sequence number without gaps or overlaps, and agree with page numbers', async () => {
      const first = await trail('pageSize=5');
      expect(first.items).toHaveLength(5);
      expect(first.total).toBeGreaterThan(10);
      const seqs = first.items.map((e) => e.seq);
      expect(seqs).toEqual([...seqs].sort((a, b) => b - a));
      const second = await trail(`pageSize=5&cursor=${first.nextCursor}`);
      expect(second.items[0].seq).toBeLessThan(seqs[4]);
      expect((await trail('pageSize=5&page=2')).items.map((e) => e.seq)).toEqual(second.items.map((e) => e.seq));
      const last = await trail(`pageSize=5&page=${Math.ceil(first.total / 5)}`);
      expect(last.items.length).toBeGreaterThan(0);
      const afterLast = await trail(`pageSize=200&cursor=${last.items[last.items.length - 1].seq}`);
      expect(afterLast).toMatchObject({ items: [], nextCursor: null });
    });

    it('should filter by person, action, day and free text', async () => {
      const reviewer = await userId(t, DEMO.reviewer);
      const byPerson = await trail(`user=${reviewer}&pageSize=200`);
      expect(byPerson.items.length).toBeGreaterThan(0);
      expect(byPerson.items.every((e) => e.actorId === reviewer)).toBe(true);
      const returned = await trail('action=study.returned');
      expect(returned.items.map((e) => e.entityId)).toContain(returnedStudy);
      expect(returned.items.every((e) => e.action === 'study.returned')).toBe(true);
      const today = new Date().toISOString().slice(0, 10);
      expect((await trail(`from=${today}&to=${today}`)).total).toBeGreaterThan(0);
      expect((await trail('from=2001-01-01&to=2001-12-31')).total).toBe(0);
      const words = await trail('q=returned for changes');
      expect(words.items.map((e) => e.action)).toContain('study.returned');
      const reason = await trail('q=check the blanks');
      expect(reason.items.map((e) => e.entityId)).toContain(returnedStudy);
      expect((await trail('q=100%_')).total).toBe(0);
    });
  });

  describe('exports', () => {
    it('should export the filtered trail as CSV with formulas neutralised', async () => {
      const res = await t
        .http()
        .get(`/api/audit/export?format=csv&record=study:${returnedStudy}`)
        .set(as('quality'))
        .buffer(true)
        .parse(binary)
        .expect(200);
      expect(res.headers['content-type']).toMatch(/text\/csv/);
      expect(res.headers['content-disposition']).toMatch(/attachment; filename="meritline-audit-trail-.*\.csv"/);
      const csv = (res.body as Buffer).toString('utf8');
      expect(csv.startsWith('\uFEFFEntry number,When (UTC),Who,What,Record,Record id,Old and new values,Reason')).toBe(true);
      expect(csv).toContain('Study returned for changes');
      expect(csv).toContain(`"'=HYPERLINK(""http://example.invalid"",""check the blanks"")"`);
      expect(csv).not.toMatch(/,=HYPERLINK/);
    });

    it('should export a PDF extract signed with the laboratory certificate', async () => {
      const res = await t
        .http()
        .get(`/api/audit/export?format=pdf&record=study:${returnedStudy}`)
        .set(as('quality'))
        .buffer(true)
        .parse(binary)
        .expect(200);
      expect(res.headers['content-type']).toBe('application/pdf');
      const file = saved('extract.pdf', res.body as Buffer);
      expect(pdfsig(file)).toContain('Signature is Valid.');
      const text = pdftotext(file);
      expect(text).toContain('Audit-trail extract');
      expect(text).toContain('Study returned for changes');
      expect(text).toContain('Chain intact');
      expect(text).not.toMatch(/study\.returned|signature\.authored/);
      writeFileSync(new URL('../test-output/audit-extract.pdf', import.meta.url), res.body as Buffer);
    });

    it('should refuse an unknown format (422)', async () => {
      const res = await t.http().get('/api/audit/export?format=xlsx').set(as('quality')).expect(422);
      expect(res.body.errors[0]).toMatchObject({ field: 'format' });
    });
  });

  describe('signed reviews of the trail', () => {
    it('should refuse a wrong password (401) and store nothing', async () => {
      const res = await t
        .http()
        .post('/api/audit/reviews')
        .set(as('quality'))
        .send({ scope: 'record', record: `study:${ownStudy}`, password: 'not-my-password' })
        .expect(401);
      expect(res.body.message).toBe('Password not correct; nothing was signed.');
      expect((await t.http().get('/api/audit/reviews').set(as('quality')).expect(200)).body).toEqual([]);
      const failed = await trail('action=signature.failed');
      expect(failed.items[0]).toMatchObject({ entity: 'audit-review', actorName: 'Jonas Lindqvist' });
    });

    it('should refuse analysts and reviewers (403), bad input (422) and an unknown record (404)', async () => {
      const body = { scope: 'period', periodFrom: '2026-11-01', periodTo: '2026-11-30', password: DEMO_PASSWORD };
      await t.http().post('/api/audit/reviews').set(as('analyst')).send(body).expect(403);
      await t.http().post('/api/audit/reviews').set(as('reviewer')).send(body).expect(403);
      const missing = await t
        .http()
        .post('/api/audit/reviews')
        .set(as('quality'))
        .send({ scope: 'period', password: DEMO_PASSWORD })
        .expect(422);
      expect(missing.body.errors.map((e: { field: string }) => e.field)).toEqual(['periodFrom', 'periodTo']);
      await t.http().post('/api/audit/reviews').set(as('quality')).send({ scope: 'everything', password: DEMO_PASSWORD }).expect(422);
      await t
        .http()
        .post('/api/audit/reviews')
        .set(as('quality'))
        .send({ scope: 'record', record: 'study:00000000-0000-4000-8000-000000000000', password: DEMO_PASSWORD })
        .expect(404);
    });

    it('should sign a review of a record, keep it as the latest and audit it', async () => {
      const res = await t
        .http()
        .post('/api/audit/reviews')
        .set(as('quality'))
        .send({ scope: 'record', record: `study:${ownStudy}`, comment: 'Submission trail complete.', password: DEMO_PASSWORD })
        .expect(201);
      expect(res.body).toMatchObject({
        scope: 'record',
        recordKind: 'study',
        recordId: ownStudy,
        reviewerName: 'Jonas Lindqvist',
        entries: 2,
        chainIntact: true,
        comment: 'Submission trail complete.',
      });
      expect(res.body.subject).toMatch(/^Validation study “/);
      const latest = await t.http().get('/api/audit/reviews').set(as('analyst')).expect(200);
      expect(latest.body[0].id).toBe(res.body.id);
      const entry = (await trail('action=audit.reviewed')).items[0];
      expect(entry).toMatchObject({
        entityId: res.body.id,
        actionText: 'Audit trail marked as reviewed',
        reason: 'Submission trail complete.',
      });
      expect((await t.http().get('/api/audit/verify').set(as('quality')).expect(200)).body).toMatchObject({ ok: true });
    });
  });
});
