import { createHash, randomUUID } from 'node:crypto';
import { createRequire } from 'node:module';
import pg from 'pg';
import { DataSource } from 'typeorm';
import {
  canonicalJson,
  ENGINE_VERSION,
  evaluateStudy,
  type MethodSummaryDto,
  type PreparationStep,
  type StudyInput,
} from '@meritline/shared';
import { MethodVersion } from '../../src/methods/method-version.entity.js';
import { Method } from '../../src/methods/method.entity.js';
import { ValidationStudy } from '../../src/studies/validation-study.entity.js';
import { User } from '../../src/users/user.entity.js';
import type { TestApp } from './test-app.js';

/** better-sqlite3 ships no types; the tests need only these calls to reach the file behind the API. */
interface SqliteFile {
  prepare(sql: string): { reader: boolean; all(...params: unknown[]): unknown[]; run(...params: unknown[]): { changes: number } };
  close(): void;
}
const Sqlite = createRequire(import.meta.url)('better-sqlite3') as new (path: string, options?: { readonly?: boolean }) => SqliteFile;

/** The database behind the API, in plain SQL with `?` placeholders, the same on SQLite and PostgreSQL. */
export interface DirectDatabase {
  all<T = Record<string, unknown>>(sql: string, ...params: unknown[]): Promise<T[]>;
  get<T = Record<string, unknown>>(sql: string, ...params: unknown[]): Promise<T | undefined>;
  /** Returns the number of rows changed. */
  run(sql: string, ...params: unknown[]): Promise<number>;
  close(): Promise<void>;
}

// COUNT(*) is a bigint and arrives as a string from pg; the tests compare it with numbers as on SQLite.
const pgTypes = {
  getTypeParser: (oid: number, format?: 'text' | 'binary') =>
    oid === pg.types.builtins.INT8 || oid === pg.types.builtins.NUMERIC ? Number : pg.types.getTypeParser(oid, format),
} as pg.CustomTypesConfig;

/** Opens the test database directly, as someone with access to the file or the database server could, bypassing the API. */
export async function openDatabase(t: TestApp, options: { readonly?: boolean } = {}): Promise<DirectDatabase> {
  if (t.databaseUrl.startsWith('sqlite:')) {
    const db = new Sqlite(t.databaseUrl.slice('sqlite:'.length), options);
    return {
      all: <T>(sql: string, ...params: unknown[]) => {
        const statement = db.prepare(sql);
        if (statement.reader) return Promise.resolve(statement.all(...params) as T[]);
        statement.run(...params);
        return Promise.resolve([]);
      },
      get: <T>(sql: string, ...params: unknown[]) => Promise.resolve(db.prepare(sql).all(...params)[0] as T | undefined),
      run: (sql: string, ...params: unknown[]) => Promise.resolve(db.prepare(sql).run(...params).changes),
      close: () => Promise.resolve(db.close()),
    };
  }
  const client = new pg.Client({
    connectionString: t.databaseUrl,
    types: pgTypes,
    ...(options.readonly ? { options: '-c default_transaction_read_only=on' } : {}),
  });
  await client.connect();
  const query = (sql: string, params: unknown[]) => {
    let n = 0;
    return client.query(
      sql.replace(/\?/g, () => `$${++n}`),
      params,
    );
  };
  return {
    all: async <T>(sql: string, ...params: unknown[]) => (await query(sql, params)).rows as T[],
    get: async <T>(sql: string, ...params: unknown[]) => (await query(sql, params)).rows[0] as T | undefined,
    run: async (sql: string, ...params: unknown[]) => (await query(sql, params)).rowCount ?? 0,
    close: () => client.end(),
  };
}

/** One piece of work on the database behind the API, closing the connection afterwards. */
export async function withDatabase<T>(
  t: TestApp,
  work: (db: DirectDatabase) => Promise<T>,
  options: { readonly?: boolean } = {},
): Promise<T> {
  const db = await openDatabase(t, options);
  try {
    return await work(db);
  } finally {
    await db.close();
  }
}

/** One statement on the database behind the API, through a connection of its own; its rows, if any. */
export function queryDatabase<T = Record<string, unknown>>(t: TestApp, sql: string, ...params: unknown[]): Promise<T[]> {
  return withDatabase(t, (db) => db.all<T>(sql, ...params));
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

/** The invented nitrate method of the API tests, without its name. */
export const NITRATE_METHOD = {
  analyte: 'Nitrate',
  matrix: 'Drinking water',
  technique: 'UV-Vis',
  xUnit: 'mg/L',
  yUnit: 'AU',
  purpose: 'assay',
} satisfies Omit<MethodSummaryDto, 'id' | 'name'>;

/** Two invented serial dilutions: 1 mL to 100 mL, then 5 mL to 50 mL. */
export const TWO_DILUTIONS = [
  {
    aliquot: 1,
    aliquotTolerance: 0.008,
    aliquotDistribution: 'triangular',
    volume: 100,
    volumeTolerance: 0.1,
    volumeDistribution: 'triangular',
  },
  {
    aliquot: 5,
    aliquotTolerance: 0.015,
    aliquotDistribution: 'rectangular',
    volume: 50,
    volumeTolerance: 0.06,
    volumeDistribution: 'triangular',
  },
] satisfies PreparationStep[];

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
      ...NITRATE_METHOD,
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
  return withDatabase(
    t,
    async (db) => {
      const count = async (table: string) => (await db.get<{ n: number }>(`SELECT COUNT(*) AS n FROM ${table}`))!.n;
      return {
        study: await db.get(
          'SELECT status, lock_version, data, result, submitted_at, approved_at FROM validation_studies WHERE id = ?',
          studyId,
        ),
        signatures: await count('study_signatures'),
        comments: await count('study_comments'),
        notifications: await count('notifications'),
        studies: await count('validation_studies'),
        outbox: await count('outbox_messages'),
      };
    },
    { readonly: true },
  );
}

export function bearer(token: string) {
  return { Authorization: `Bearer ${token}` };
}
