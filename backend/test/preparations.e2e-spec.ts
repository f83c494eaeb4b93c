import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { binary } from './support/flows.js';
import { bearer, calibrationData, queryDatabase, TWO_DILUTIONS } from './support/review-fixtures.js';
import { createTestApp, DEMO, type TestApp } from './support/test-app.js';

const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';
const REFERENCE_DATA = process.env.REFERENCE_DATA_DIR ?? '/work/shared/reference-data';
const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);
const relClose = (actual: number, expected: number, rel = 1e-9) =>
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(rel);

// Eurachem/CITAC Guide CG 4 (QUAM, 3rd ed. 2012), Example A1: cadmium calibration standard, as read in the
// reference file (inputs of QUAM A1.4; unrounded result and budget recomputed there and checked against the GTC documentation).
const quam = JSON.parse(readFileSync(`${REFERENCE_DATA}/uncertainty_quam_a1_cadmium_standard.json`, 'utf8'));
const q = quam.inputs;
const quamStock = {
  mass: q.m.value_mg,
  uMass: q.m.u_mg,
  massUnit: 'mg',
  volume: q.V.value_mL,
  volumeTolerance: q.V.calibration.half_width_mL,
  volumeDistribution: q.V.calibration.distribution,
  volumeRepeatability: q.V.repeatability.u_mL,
  temperatureRange: q.V.temperature.delta_T_degC,
  expansionCoefficient: q.V.temperature.volume_expansion_coefficient_water_per_degC,
};

describe('standard preparations', () => {
  let t: TestApp;
  let analyst: string;
  let reviewer: string;
  let quality: string;
  const materials: Record<string, { id: string; lockVersion: number; certifiedValue: number; standardUncertainty: number }> = {};
  const query = <T>(sql: string, ...params: unknown[]) => queryDatabase<T>(t, sql, ...params);
  const count = async () => (await query<{ n: number }>('SELECT COUNT(*) AS n FROM standard_preparations'))[0].n;
  const preview = (body: unknown, token = analyst) =>
    t
      .http()
      .post('/api/preparations/preview')
      .set(bearer(token))
      .send(body as object);
  const fromMaterial = (materialId: string, extra: Record<string, unknown> = {}) => ({
    source: { materialId },
    stock: { mass: 100.1, uMass: 0.05, massUnit: 'mg', volume: 100, volumeTolerance: 0.1, volumeDistribution: 'triangular' },
    steps: TWO_DILUTIONS,
    ...extra,
  });
  const registerMaterial = async (extra: Record<string, unknown>) =>
    (
      await t
        .http()
        .post('/api/reference-materials')
        .set(bearer(quality))
        .send({
          name: 'Invented test material',
          analyte: 'Cadmium',
          supplier: 'Test Supplies',
          lot: `T-${Math.random().toString(36).slice(2, 8)}`,
          certificateNumber: 'T-1',
          valueKind: 'purity',
          certifiedValue: 0.999,
          unit: 'g/g',
          standardUncertainty: 0.0003,
          receivedOn: day(-400),
          expiresOn: day(200),
          ...extra,
        })
        .expect(201)
    ).body;

  beforeAll(async () => {
    t = await createTestApp();
    [analyst, reviewer, quality] = await Promise.all([t.tokenFor(DEMO.analyst), t.tokenFor(DEMO.reviewer), t.tokenFor(DEMO.quality)]);
    const list = (await t.http().get('/api/reference-materials').set(bearer(analyst)).expect(200)).body;
    for (const m of list) materials[m.analyte] = m;
  });
  afterAll(() => t.close());

  describe('POST /api/preparations/preview', () => {
    it('should refuse anonymous callers (401)', async () => {
      await t.http().post('/api/preparations/preview').send(fromMaterial(materials.Cadmium.id)).expect(401);
    });

    it('should give the QUAM A1 cadmium stock, u_c and every budget contribution, and save nothing', async () => {
      const before = await count();
      const uPurity = q.P.half_width / Math.sqrt(3); // rectangular, as QUAM A1.4 treats the purity tolerance
      const res = await preview({ source: { purity: q.P.value, uPurity }, stock: quamStock, steps: [] }, reviewer).expect(200);
      const { stock } = res.body;
      const expected = quam.computed_unrounded;
      relClose(stock.concentration, expected.c_mg_per_L);
      relClose(stock.u, expected.u_c_mg_per_L);
      relClose(stock.relativeU, expected.u_rel);
      expect(stock.unit).toBe('mg/L');
      // QUAM prints c = 1002.7 mg/L.
      expect(stock.concentration.toFixed(1)).toBe('1002.7');
      const contribution = (quantity: string) => stock.budget.find((b: { quantity: string }) => b.quantity === quantity).contribution;
      const published = expected['contributions_mg_per_L_|dc/dx|u(x)'];
      relClose(contribution('mass'), published.m);
      relClose(contribution('purity'), published.P);
      relClose(contribution('volume'), published.V_total);
      relClose(contribution('volumeCalibration'), published.V_calibration);
      relClose(contribution('volumeRepeatability'), published.V_repeatability);
      relClose(contribution('volumeTemperature'), published.V_temperature);
      relClose(stock.budget.find((b: { quantity: string }) => b.quantity === 'volume').u, q.V.u_mL);
      expect(res.body.steps).toEqual([]);
      expect(await count()).toBe(before);
    });

    it('should carry the stock through two dilutions, u combined in quadrature (GUM 5.1.6; a/√3 and a/√6, common practice)', async () => {
      const res = await preview({ source: { purity: q.P.value, uPurity: q.P.u }, stock: quamStock, steps: TWO_DILUTIONS }).expect(200);
      const { stock, steps } = res.body;
      expect(steps).toHaveLength(2);
      const c1 = (stock.concentration * 1) / 100;
      const r1 = Math.hypot(stock.relativeU, 0.008 / Math.sqrt(6) / 1, 0.1 / Math.sqrt(6) / 100);
      const c2 = (c1 * 5) / 50;
      const r2 = Math.hypot(r1, 0.015 / Math.sqrt(3) / 5, 0.06 / Math.sqrt(6) / 50);
      relClose(steps[0].concentration, c1);
      relClose(steps[0].u, c1 * r1);
      relClose(steps[1].concentration, c2);
      relClose(steps[1].u, c2 * r2);
    });

    it('should take the purity and u = U/k of a registered material', async () => {
      const cadmium = materials.Cadmium;
      const res = await preview(fromMaterial(cadmium.id)).expect(200);
      const purity = res.body.stock.budget.find((b: { quantity: string }) => b.quantity === 'purity');
      expect(purity.value).toBe(cadmium.certifiedValue);
      relClose(purity.u, cadmium.standardUncertainty);
      relClose(res.body.stock.concentration, (1000 * 100.1 * cadmium.certifiedValue) / 100);
    });

    it.each([
      ['source.purity', { source: { purity: 1.2, uPurity: 0.001 } }, 'out_of_range'],
      ['source.purity', { source: { purity: 0, uPurity: 0.001 } }, 'out_of_range'],
      ['source.uPurity', { source: { purity: 0.99, uPurity: -0.001 } }, 'negative'],
      ['stock.volume', { stock: { ...quamStock, volume: 0 } }, 'not_positive'],
      ['stock.mass', { stock: { ...quamStock, mass: -5 } }, 'not_positive'],
      ['stock.uMass', { stock: { ...quamStock, uMass: -0.01 } }, 'negative'],
      ['stock.volumeTolerance', { stock: { ...quamStock, volumeTolerance: -0.1 } }, 'negative'],
      ['stock.massUnit', { stock: { ...quamStock, massUnit: 'kg' } }, 'isIn'],
      ['stock.volume', { stock: { ...quamStock, volume: 1e300 } }, 'max'],
      ['steps[1].volume', { steps: [TWO_DILUTIONS[0], { ...TWO_DILUTIONS[1], volume: -50 }] }, 'not_positive'],
      ['steps[0].aliquotTolerance', { steps: [{ ...TWO_DILUTIONS[0], aliquotTolerance: -0.01 }] }, 'negative'],
      ['steps[0].aliquot', { steps: [{ ...TWO_DILUTIONS[0], aliquot: 200 }] }, 'out_of_range'],
      ['steps', { steps: Array(13).fill(TWO_DILUTIONS[0]) }, 'arrayMaxSize'],
      ['source', { source: {} }, 'required'],
      ['source', { source: { materialId: UNKNOWN_ID, purity: 0.9 } }, 'ambiguous'],
      ['source.materialId', { source: { materialId: UNKNOWN_ID } }, 'not_found'],
    ])('should refuse %s with 422, the field and the reason (%j)', async (field, override, code) => {
      const body = { source: { purity: 0.9999, uPurity: 0.00006 }, stock: quamStock, steps: [], ...override };
      const res = await preview(body).expect(422);
      const error = res.body.errors.find((e: { field: string }) => e.field === field);
      expect(error, JSON.stringify(res.body)).toMatchObject({ field, code });
      expect(error.message).not.toMatch(/stock\.|source\.|steps\[/);
    });

    it('should refuse an expired, a withdrawn or a content-certified material (422)', async () => {
      const expired = await registerMaterial({ expiresOn: day(-1) });
      const res = await preview(fromMaterial(expired.id)).expect(422);
      expect(res.body.errors[0]).toMatchObject({ field: 'source.materialId', code: 'expired' });
      expect(res.body.errors[0].message).toContain(`expired on ${day(-1)}`);
      const withdrawn = await registerMaterial({});
      await t
        .http()
        .post(`/api/reference-materials/${withdrawn.id}/withdraw`)
        .set(bearer(quality))
        .send({ reason: 'Spilled', lockVersion: 1 })
        .expect(200);
      expect((await preview(fromMaterial(withdrawn.id)).expect(422)).body.errors[0]).toMatchObject({
        field: 'source.materialId',
        code: 'withdrawn',
      });
      expect((await preview(fromMaterial(materials.Lead.id)).expect(422)).body.errors[0]).toMatchObject({ code: 'not_purity' });
    });

    it('should answer 422 naming the field for null in place of an optional source or stock value, never 500', async () => {
      const nulls: [Record<string, unknown>, string][] = [
        [{ ...fromMaterial(materials.Cadmium.id), source: { materialId: null } }, 'source.materialId'],
        [{ ...fromMaterial(materials.Cadmium.id), source: { purity: null, uPurity: 0.0001 } }, 'source.purity'],
        [{ ...fromMaterial(materials.Cadmium.id), stock: { ...fromMaterial(materials.Cadmium.id).stock, uMass: null } }, 'stock.uMass'],
      ];
      for (const [body, field] of nulls) {
        const res = await preview(body);
        expect(res.status, field).toBe(422);
        expect(res.body.errors[0].field).toBe(field);
      }
    });
  });

  describe('POST /api/preparations, GET /api/preparations[/:id]', () => {
    it('should save for analysts only, audited, and refuse others (401, 403) and bad input (422) saving nothing', async () => {
      const body = { name: 'Cadmium 1000 mg/L and working standards', ...fromMaterial(materials.Cadmium.id) };
      const before = await count();
      await t.http().post('/api/preparations').send(body).expect(401);
      await t.http().post('/api/preparations').set(bearer(quality)).send(body).expect(403);
      await t.http().post('/api/preparations').set(bearer(reviewer)).send(body).expect(403);
      const noName = await t
        .http()
        .post('/api/preparations')
        .set(bearer(analyst))
        .send({ ...body, name: '' })
        .expect(422);
      expect(noName.body.errors[0].field).toBe('name');
      await t
        .http()
        .post('/api/preparations')
        .set(bearer(analyst))
        .send({ ...body, stock: { ...body.stock, volume: -1 } })
        .expect(422);
      expect(await count()).toBe(before);

      const saved = (await t.http().post('/api/preparations').set(bearer(analyst)).send(body).expect(201)).body;
      expect(saved).toMatchObject({ name: body.name, material: { id: materials.Cadmium.id }, createdBy: { name: 'Alma Ruiz' } });
      expect(saved.result.steps).toHaveLength(2);
      expect(saved.source.purity).toBe(materials.Cadmium.certifiedValue);
      expect(await count()).toBe(before + 1);
      const audit = await query<{ action: string }>('SELECT action FROM audit_entries WHERE entity_id = ?', saved.id);
      expect(audit.map((a) => a.action)).toEqual(['preparation.created']);

      const one = (await t.http().get(`/api/preparations/${saved.id}`).set(bearer(reviewer)).expect(200)).body;
      expect(one).toEqual(saved);
      const list = (await t.http().get('/api/preparations').set(bearer(quality)).expect(200)).body;
      expect(list[0].id).toBe(saved.id);
      await t.http().get('/api/preparations').expect(401);
      await t.http().get(`/api/preparations/${saved.id}`).expect(401);
      await t.http().get(`/api/preparations/${UNKNOWN_ID}`).set(bearer(analyst)).expect(404);
      // Saved for good: there is no route to change or delete one.
      await t.http().patch(`/api/preparations/${saved.id}`).set(bearer(analyst)).send({ name: 'x' }).expect(404);
      await t.http().delete(`/api/preparations/${saved.id}`).set(bearer(analyst)).expect(404);
    });
  });

  describe('standards of a study naming a preparation', () => {
    it('should accept a saved preparation of a material in use and refuse an unknown one or one whose material expired (422)', async () => {
      const methods = (await t.http().get('/api/methods').set(bearer(analyst)).expect(200)).body as {
        versions: { id: string; status: string }[];
      }[];
      const versionId = methods.flatMap((m) => m.versions).find((v) => v.status === 'active')!.id;
      const material = await registerMaterial({});
      const prep = (
        await t
          .http()
          .post('/api/preparations')
          .set(bearer(analyst))
          .send({ name: 'Working standards', ...fromMaterial(material.id) })
          .expect(201)
      ).body;
      const data = (preparationId: string) => {
        const d = calibrationData();
        return { ...d, standards: d.standards!.map((s, i) => (i < 2 ? { ...s, preparationId } : s)) };
      };
      const studies = async () => (await query<{ n: number }>('SELECT COUNT(*) AS n FROM validation_studies'))[0].n;
      const before = await studies();
      const unknown = await t
        .http()
        .post('/api/studies')
        .set(bearer(analyst))
        .send({ methodVersionId: versionId, title: 'With an unknown preparation', data: data(UNKNOWN_ID) })
        .expect(422);
      expect(unknown.body.errors[0]).toMatchObject({ field: 'standards[0].preparationId', code: 'not_found' });
      expect(await studies()).toBe(before);

      const study = (
        await t
          .http()
          .post('/api/studies')
          .set(bearer(analyst))
          .send({ methodVersionId: versionId, title: 'Traceable standards', data: data(prep.id) })
          .expect(201)
      ).body;
      expect(study.data.standards[0].preparationId).toBe(prep.id);

      // The draft report prints the chain material and lot → stock → working standards with each u.
      const pdf = await t.http().get(`/api/studies/${study.id}/report`).set(bearer(analyst)).buffer(true).parse(binary).expect(200);
      const dir = mkdtempSync(join(tmpdir(), 'meritline-prep-'));
      try {
        const file = join(dir, 'report.pdf');
        writeFileSync(file, pdf.body as Buffer);
        const text = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
        expect(text).toContain('Traceability of the standards');
        expect(text).toContain(`lot ${material.lot}, certificate T-1`);
        expect(text).toContain('Standards 1 (x = 0.5), 2 (x = 0.5)');
        const stock = prep.result.stock;
        // u to two significant digits and c to the same place (GUM 7.2.6), as every estimate in the report.
        expect(stock.u).toBeGreaterThan(0.1);
        expect(text).toContain(`${stock.concentration.toFixed(2)} mg/L ${stock.u.toFixed(2)} mg/L`);
        const last = prep.result.steps[1];
        expect(last.u).toBeLessThan(0.01);
        expect(last.u).toBeGreaterThan(0.001);
        expect(text).toContain(`${last.concentration.toFixed(4)} mg/L ${last.u.toFixed(4)} mg/L`);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }

      await t
        .http()
        .patch(`/api/reference-materials/${material.id}`)
        .set(bearer(quality))
        .send({ lockVersion: 1, expiresOn: day(-3) })
        .expect(200);
      const again = await t
        .http()
        .post('/api/studies')
        .set(bearer(analyst))
        .send({ methodVersionId: versionId, title: 'Too late', data: data(prep.id) })
        .expect(422);
      expect(again.body.errors[0]).toMatchObject({ field: 'standards[0].preparationId', code: 'material_expired' });
      expect(again.body.errors[0].message).toContain(`expired on ${day(-3)}`);
      expect(await studies()).toBe(before + 1);
    });
  });
});
