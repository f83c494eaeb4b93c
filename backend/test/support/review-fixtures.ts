import { createHash, randomUUID } from 'node:crypto';
import { createRequire } from 'node:module';
import { DataSource } from 'typeorm';
import { canonicalJson, ENGINE_VERSION, evaluateStudy, type StudyInput } from '@meritline/shared';
import { MethodVersion } from '../../src/methods/method-version.entity.js';
import { Method } from '../../src/methods/method.entity.js';
import { ValidationStudy } from '../../src/studies/validation-study.entity.js';
import { User } from '../../src/users/user.entity.js';
import type { TestApp } from './test-app.js';

/** better-sqlite3 ships no types; the tests need only these calls to reach the file behind the API. */
export interface SqliteFile {
  prepare(sql: string): {
    get(...params: unknown[]): unknown;
    all(...params: unknown[]): unknown[];
    run(...params: unknown[]): { changes: number };
  };
  close(): void;
}
const Database = createRequire(import.meta.url)('better-sqlite3') as new (path: string, options?: { readonly?: boolean }) => SqliteFile;

/** Opens the test database directly, as someone with file access could, bypassing the API. */
export function openDatabaseFile(t: TestApp, options: { readonly?: boolean } = {}): SqliteFile {
  return new Database(t.databasePath, options);
}

/** Invented calibration (Riverbend demo scenario): nitrate by UV absorbance, duplicate standards at five levels. */
export function calibrationData(): StudyInput {
  const levels = [0.5, 1, 2, 4, 8];
  const noise = [0.0012, -0.0008, 0.0005, -0.0011, 0.0009, 0.0003, -0.0006, 0.001, -0.0004, 0.0007];
  return {
    units: { x: 'mg/L', y: 'AU' },
    model: 'linear',
    weighting: 'none',
    standards: levels.flatMap((x, i) => [0, 1].map((r) => ({ x, y: Number((0.004 + 0.1213 * x + noise[i * 2 + r]).toFixed(4)) }))),
    blanks: [0.0035, 0.0042, 0.0047, 0.0039],
    criteria: [{ figure: 'calibration.r2', op: '>=', value: 0.995 }],
  };
}

export interface StudyFixtureOptions {
  author: string;
  requiresQualityRelease?: boolean;
  status?: ValidationStudy['status'];
  retired?: boolean;
  editors?: string[];
  /** Leave the result out, as for a draft whose data cannot be evaluated yet. */
  withoutResult?: boolean;
}

export function dataSourceOf(t: TestApp): DataSource {
  return t.app.get(DataSource);
}

export async function userId(t: TestApp, email: string): Promise<string> {
  return (await dataSourceOf(t).getRepository(User).findOneByOrFail({ email })).id;
}

export function evaluated(data: StudyInput): Pick<ValidationStudy, 'data' | 'result' | 'resultErrors' | 'engineVersion' | 'dataHash'> {
  return {
    data: data as Record<string, unknown>,
    result: evaluateStudy(data) as unknown as Record<string, unknown>,
    resultErrors: null,
    engineVersion: ENGINE_VERSION,
    dataHash: createHash('sha256').update(canonicalJson(data)).digest('hex'),
  };
}

/** A method, a version and a study written straight to the database, so review tests need no other module's routes. */
export async function createStudy(t: TestApp, options: StudyFixtureOptions): Promise<ValidationStudy> {
  const ds = dataSourceOf(t);
  const authorId = await userId(t, options.author);
  const method = await ds.getRepository(Method).save(
    ds.getRepository(Method).create({
      name: `Nitrate in drinking water ${randomUUID().slice(0, 8)}`,
      analyte: 'Nitrate',
      matrix: 'Drinking water',
      technique: 'UV-Vis',
      xUnit: 'mg/L',
      yUnit: 'AU',
      purpose: 'assay',
      createdById: authorId,
    }),
  );
  const version = await ds.getRepository(MethodVersion).save(
    ds.getRepository(MethodVersion).create({
      methodId: method.id,
      number: 1,
      changeSummary: 'First version',
      status: options.retired ? 'retired' : 'active',
      criteria: [{ figure: 'calibration.r2', op: '>=', value: 0.995 }],
      settings: { requiresQualityRelease: options.requiresQualityRelease ?? false, checkTolerancePct: 10, onePointMaxInterceptPct: 2 },
      createdById: authorId,
    }),
  );
  const content = evaluated(calibrationData());
  const editorIds = await Promise.all((options.editors ?? []).map((email) => userId(t, email)));
  return ds.getRepository(ValidationStudy).save(
    ds.getRepository(ValidationStudy).create({
      methodVersionId: version.id,
      title: `Nitrate calibration ${randomUUID().slice(0, 6)}`,
      status: options.status ?? 'draft',
      ...content,
      ...(options.withoutResult
        ? {
            result: null,
            resultErrors: [{ field: 'standards', code: 'too_few', message: 'Enter at least 3 standards for a straight-line calibration.' }],
          }
        : {}),
      meta: { instrument: 'UV-1 bench spectrophotometer' },
      authorId,
      editorIds,
      copiedFromId: null,
      submittedAt: null,
      approvedAt: null,
    }),
  );
}

/** Counts and states that a refused request must leave as they were. */
export function databaseState(t: TestApp, studyId: string) {
  const db = openDatabaseFile(t, { readonly: true });
  try {
    const count = (table: string) => (db.prepare(`SELECT COUNT(*) AS n FROM ${table}`).get() as { n: number }).n;
    return {
      study: db
        .prepare('SELECT status, lock_version, data, result, submitted_at, approved_at FROM validation_studies WHERE id = ?')
        .get(studyId),
      signatures: count('study_signatures'),
      comments: count('study_comments'),
      notifications: count('notifications'),
      studies: count('validation_studies'),
      outbox: count('outbox_messages'),
    };
  } finally {
    db.close();
  }
}

export function bearer(token: string) {
  return { Authorization: `Bearer ${token}` };
}
