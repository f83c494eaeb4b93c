import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, createStudy, databaseState, queryDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

// Invented low-level spikes and method blanks (mg/L); the fourth spike was spiked twice, the second blank is a contaminated vial.
const SPIKED = [0.21, 0.18, 0.24, 0.43, 0.2, 0.17, 0.22, 0.19, 0.23];
const BLANKS = [0.02, 0.11, 0.03, 0.01, null, 0.02, 0.04];
const SPIKE_REASON = 'Spiked twice: the pipette was refilled without emptying.';
const BLANK_REASON = 'Contaminated vial (cap left open).';

/* eslint-disable @typescript-eslint/no-explicit-any -- study data and results are plain JSON */
describe('excluded low-level spike results and MDL blanks', () => {
  let t: TestApp;
  const token: Record<keyof typeof DEMO, string> = { analyst: '', analyst2: '', reviewer: '', quality: '', admin: '' };
  const as = (who: keyof typeof DEMO) => bearer(token[who]);
  const patch = (id: string, body: Record<string, unknown>, who: keyof typeof DEMO = 'analyst') =>
    t.http().patch(`/api/studies/${id}`).set(as(who)).send(body);
  const newStudy = async () => {
    const { id } = await createStudy(t, { author: DEMO.analyst });
    return (await t.http().get(`/api/studies/${id}`).set(as('analyst')).expect(200)).body as { id: string; lockVersion: number; data: any };
  };
  const withExclusions = {
    spiked: SPIKED.map((value, i) => (i === 3 ? { value, excluded: { reason: SPIKE_REASON } } : value)),
    blanks: BLANKS.map((value, i) => (i === 1 ? { value, excluded: { reason: BLANK_REASON } } : value)),
  };

  beforeAll(async () => {
    t = await createTestApp();
    for (const who of Object.keys(DEMO) as (keyof typeof DEMO)[]) token[who] = await t.tokenFor(DEMO[who]);
  });
  afterAll(() => t.close());

  it('should save the exclusions, compute the MDL as without those rows, list them with their reasons and audit each', async () => {
    const study = await newStudy();
    const plain = await patch(study.id, {
      lockVersion: study.lockVersion,
      data: { ...study.data, lowSpikes: { spiked: SPIKED, blanks: BLANKS } },
    });
    expect(plain.status).toBe(200);
    const res = await patch(study.id, { lockVersion: plain.body.lockVersion, data: { ...study.data, lowSpikes: withExclusions } }).expect(
      200,
    );
    expect(res.body.data.lowSpikes).toEqual(withExclusions);

    const withoutRows = { spiked: SPIKED.filter((_, i) => i !== 3), blanks: BLANKS.filter((_, i) => i !== 1) };
    const other = await newStudy();
    const reference = await patch(other.id, { lockVersion: other.lockVersion, data: { ...other.data, lowSpikes: withoutRows } }).expect(
      200,
    );
    const { excludedSpikes, excludedMdlBlanks, ...figures } = res.body.result.detection;
    expect(figures).toEqual(reference.body.result.detection);
    expect(figures.epaMdl).toMatchObject({ nSpiked: 8, nBlanks: 6, blankRule: 'highest', mdlBlank: 0.04 });
    expect(plain.body.result.detection.epaMdl).toMatchObject({ nSpiked: 9, nBlanks: 7, mdlBlank: 0.11 });
    expect(excludedSpikes).toEqual([{ index: 3, label: 'spike 4', value: 0.43, reason: SPIKE_REASON }]);
    expect(excludedMdlBlanks).toEqual([{ index: 1, label: 'method blank 2', value: 0.11, reason: BLANK_REASON }]);
    // The engine route gives the same figures for the same data.
    const evaluated = await t
      .http()
      .post('/api/evaluate')
      .set(as('analyst'))
      .send({ ...study.data, lowSpikes: withExclusions })
      .expect(200);
    expect(evaluated.body.detection.epaMdl).toEqual(figures.epaMdl);

    const entries = await queryDatabase<{ changes: string; reason: string | null }>(
      t,
      'SELECT changes, reason FROM audit_entries WHERE entity_id = ? AND action = ? ORDER BY seq',
      study.id,
      'study.point-excluded',
    );
    expect(entries.map((e) => [JSON.parse(e.changes), e.reason])).toEqual([
      [{ 'lowSpikes.spiked[3].excluded': { from: null, to: { reason: SPIKE_REASON } } }, SPIKE_REASON],
      [{ 'lowSpikes.blanks[1].excluded': { from: null, to: { reason: BLANK_REASON } } }, BLANK_REASON],
    ]);
    const history = (await t.http().get(`/api/studies/${study.id}/history`).set(as('reviewer')).expect(200)).body as {
      action: string;
      lines?: string[];
    }[];
    expect(history.filter((h) => h.action === 'study.point-excluded').flatMap((h) => h.lines)).toEqual(
      expect.arrayContaining([
        `Low-level spikes, row 4, excluded: nothing → excluded (${SPIKE_REASON})`,
        `Method blanks (detection limit), row 2, excluded: nothing → excluded (${BLANK_REASON})`,
      ]),
    );

    const included = await patch(study.id, {
      lockVersion: res.body.lockVersion,
      data: { ...study.data, lowSpikes: { spiked: SPIKED, blanks: BLANKS } },
    });
    expect(included.status).toBe(200);
    expect(included.body.result.detection.epaMdl).toEqual(plain.body.result.detection.epaMdl);
    const back = await queryDatabase<{ changes: string }>(
      t,
      'SELECT changes FROM audit_entries WHERE entity_id = ? AND action = ? ORDER BY seq',
      study.id,
      'study.point-included',
    );
    expect(back.map((e) => Object.keys(JSON.parse(e.changes))[0])).toEqual([
      'lowSpikes.spiked[3].excluded',
      'lowSpikes.blanks[1].excluded',
    ]);
  });

  it('should read an imported CSV as plain results that can then be excluded, and keep exclusions when another section is imported', async () => {
    const study = await newStudy();
    const upload = (section: string, csv: string, lockVersion: number) =>
      t
        .http()
        .post(`/api/studies/${study.id}/imports`)
        .set(as('analyst'))
        .attach('file', Buffer.from(csv), `${section}.csv`)
        .field('section', section)
        .field('lockVersion', String(lockVersion));
    const csv = `spiked,blank\n${SPIKED.map((v, i) => `${v},${i < BLANKS.length ? (BLANKS[i] ?? 'ND') : ''}`).join('\n')}\n`;
    const imported = await upload('lowSpikes', csv, study.lockVersion).expect(200);
    expect(imported.body.data.lowSpikes).toEqual({ spiked: SPIKED, blanks: BLANKS });
    const excluded = await patch(study.id, {
      lockVersion: imported.body.lockVersion,
      data: { ...imported.body.data, lowSpikes: withExclusions },
    }).expect(200);
    const blanks = await upload('blanks', 'value\n0.0011\n0.0018\n0.0009\n', excluded.body.lockVersion).expect(200);
    expect(blanks.body.data.lowSpikes).toEqual(withExclusions);
    expect(blanks.body.result.detection.excludedSpikes).toEqual([{ index: 3, label: 'spike 4', value: 0.43, reason: SPIKE_REASON }]);
  });

  it('should answer a bad exclusion with 422 naming the field, and save nothing', async () => {
    const study = await newStudy();
    const before = await databaseState(t, study.id);
    const cases: [unknown, string][] = [
      [{ spiked: [0.2, { value: 0.21, excluded: { reason: '' } }] }, 'lowSpikes.spiked[1].excluded.reason'],
      [{ spiked: [0.2, { value: 0.21, excluded: { reason: 7 } }] }, 'lowSpikes.spiked[1].excluded.reason'],
      [{ spiked: [0.2, { value: 'high', excluded: { reason: SPIKE_REASON } }] }, 'lowSpikes.spiked[1].value'],
      [{ spiked: [{ value: null, excluded: { reason: SPIKE_REASON } }] }, 'lowSpikes.spiked[0].value'],
      [{ spiked: [0.2, { value: 0.21, why: SPIKE_REASON }] }, 'lowSpikes.spiked[1].why'],
      [{ spiked: [0.2], blanks: [{ value: 'ND', excluded: { reason: BLANK_REASON } }] }, 'lowSpikes.blanks[0].value'],
      [{ spiked: [0.2], blanks: [{ value: 0.01, excluded: 'yes' }] }, 'lowSpikes.blanks[0].excluded'],
      [{ spiked: [0.2], blanks: [{ value: '0,02' }] }, 'lowSpikes.blanks[0].value'],
    ];
    for (const [lowSpikes, field] of cases) {
      const res = await patch(study.id, { lockVersion: study.lockVersion, data: { ...study.data, lowSpikes } });
      expect(res.status, field).toBe(422);
      expect(res.body.errors.map((e: { field: string }) => e.field)).toContain(field);
    }
    expect(await databaseState(t, study.id)).toEqual(before);
  });

  it('should refuse the change anonymously (401), from another analyst (403), on an unknown study (404) and with a stale lock (409)', async () => {
    const study = await newStudy();
    const body = { lockVersion: study.lockVersion, data: { ...study.data, lowSpikes: withExclusions } };
    await t.http().patch(`/api/studies/${study.id}`).send(body).expect(401);
    await patch(study.id, body, 'analyst2').expect(403);
    await patch(UNKNOWN_ID, body).expect(404);
    await patch(study.id, { ...body, lockVersion: study.lockVersion + 5 }).expect(409);
    await patch(study.id, body).expect(200);
  });
});
