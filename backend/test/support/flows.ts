import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { canonicalJson, ENGINE_VERSION, evaluateStudy, type EvaluationResult, type MethodDto, type StudyInput } from '@meritline/shared';
import { MethodVersion } from '../../src/methods/method-version.entity.js';
import { Method } from '../../src/methods/method.entity.js';
import { ValidationStudy } from '../../src/studies/validation-study.entity.js';
import { User } from '../../src/users/user.entity.js';
import { bearer, queryDatabase } from './review-fixtures.js';
import { DEMO, DEMO_PASSWORD, type TestApp } from './test-app.js';

export { bearer };

/** The steps the API tests repeat: signing in, reading the database, seeding a validated version, runs and their release. */

/** Tokens of several demo users, in the order named. */
export const tokensFor = (t: TestApp, ...emails: string[]) => Promise.all(emails.map((email) => t.tokenFor(email)));

/** The Authorization header of a demo user, signed in once per app. */
export const signedIn = async (t: TestApp, email: string) => bearer(await t.tokenFor(email));

type Row = Record<string, unknown>;

/** Rows read from the database itself (the SQLite file or a PostgreSQL connection of its own), as someone with direct access could. */
export const readRows = (t: TestApp, sql: string, ...params: unknown[]): Promise<Row[]> => queryDatabase(t, sql, ...params);

/** GET /api/methods as a demo user. */
export async function listMethods<T = MethodDto>(t: TestApp, email: string): Promise<T[]> {
  return (
    await t
      .http()
      .get('/api/methods')
      .set(await signedIn(t, email))
      .expect(200)
  ).body as T[];
}

/** Raw SQL (`?` placeholders on both databases), for checking what was (not) stored. */
export const sqlQuery = <T>(t: TestApp, sql: string, parameters: unknown[] = []): Promise<T[]> => queryDatabase<T>(t, sql, ...parameters);

type BodyParser = Parameters<ReturnType<ReturnType<TestApp['http']>['get']>['parse']>[0];

/** Collects a file answer (PDF, XLSX) into a Buffer: `.buffer(true).parse(binary)`. */
export const binary: BodyParser = (res, done) => {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

/** pdfsig (poppler) exits 0 for valid and broken signatures alike, so its words are what count. */
export const pdfsig = (file: string) => {
  const run = spawnSync('pdfsig', [file], { encoding: 'utf8' });
  return `${run.stdout}${run.stderr}`;
};

/** A scratch folder for files the tests hand to outside tools; `remove` it after all. */
export function scratchFolder(prefix: string) {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  return {
    dir,
    saved: (name: string, bytes: Buffer) => {
      const file = join(dir, name);
      writeFileSync(file, bytes);
      return file;
    },
    remove: () => rmSync(dir, { recursive: true, force: true }),
  };
}

export interface OutboxMessage {
  subject: string;
  text: string;
  to_addresses: string;
}

/** The mails with this subject, once at least `atLeast` have arrived (mail goes out after the transaction; waits up to 5 s). */
export async function outboxMessages(t: TestApp, subject: string, atLeast = 1): Promise<OutboxMessage[]> {
  const read = () => sqlQuery<OutboxMessage>(t, 'select * from outbox_messages where subject = ?', [subject]);
  for (let i = 0; i < 50; i++) {
    const rows = await read();
    if (rows.length >= atLeast) return rows;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  return read();
}

export interface ValidatedVersion {
  /** The method's name; the study is called "<name> validation" unless `studyTitle` says otherwise. */
  name: string;
  studyTitle?: string;
  method?: Partial<Method>;
  /** The validation study's data; without it the version has no study. */
  study?: StudyInput;
  /** The stored result, when a test adds to the engine's (e.g. an uncertainty). */
  result?: EvaluationResult;
  status?: MethodVersion['status'];
  studyStatus?: ValidationStudy['status'];
  onePointMaxInterceptPct?: number;
}

/** A method with one version and its validation study, written straight to the database (as a quality manager). */
export async function addValidatedVersion(t: TestApp, options: ValidatedVersion): Promise<MethodVersion> {
  const dataSource = t.app.get(DataSource);
  const author = await dataSource.getRepository(User).findOneByOrFail({ email: DEMO.quality });
  const method = await dataSource.getRepository(Method).save({
    name: options.name,
    analyte: 'analyte',
    matrix: 'water',
    technique: 'photometry',
    xUnit: 'mg/L',
    yUnit: 'AU',
    purpose: 'assay',
    createdById: author.id,
    ...options.method,
  });
  const version = await dataSource.getRepository(MethodVersion).save({
    methodId: method.id,
    number: 1,
    changeSummary: 'First version',
    status: options.status ?? 'active',
    criteria: [],
    settings: { requiresQualityRelease: false, checkTolerancePct: 10, onePointMaxInterceptPct: options.onePointMaxInterceptPct ?? 2 },
    createdById: author.id,
  });
  if (options.study) {
    const studyStatus = options.studyStatus ?? 'approved';
    await dataSource.getRepository(ValidationStudy).save({
      methodVersionId: version.id,
      title: options.studyTitle ?? `${options.name} validation`,
      status: studyStatus,
      data: options.study as Record<string, unknown>,
      result: (options.result ?? evaluateStudy(options.study)) as unknown as Record<string, unknown>,
      resultErrors: null,
      engineVersion: ENGINE_VERSION,
      dataHash: canonicalJson(options.study).slice(0, 64),
      meta: {},
      authorId: author.id,
      editorIds: [author.id],
      copiedFromId: null,
      submittedAt: new Date(),
      approvedAt: studyStatus === 'approved' ? new Date() : null,
    });
  }
  return version;
}

/** POST /api/studies/:id/<action> (submit, approve, return…) with these headers; the caller checks the status. */
export const studyAction = (t: TestApp, id: string, action: string, headers: Record<string, string>, body: object) =>
  t.http().post(`/api/studies/${id}/${action}`).set(headers).send(body);

/** POST /api/runs as the holder of `token`; the caller checks the status. */
export const postRun = (t: TestApp, token: string, body: unknown) =>
  t
    .http()
    .post('/api/runs')
    .set(bearer(token))
    .send(body as object);

/** POST /api/runs/:id/<action> (submit, release, return, supersede); the caller checks the status. */
export const runAction = (t: TestApp, id: string, action: string, token: string, body: object) =>
  t.http().post(`/api/runs/${id}/${action}`).set(bearer(token)).send(body);

/** The analyst signs the run for review; answers its new lock version. */
export async function submitRun(t: TestApp, id: string, analyst: string, version = 1): Promise<number> {
  const res = await runAction(t, id, 'submit', analyst, { password: DEMO_PASSWORD, version }).expect(200);
  return res.body.lockVersion as number;
}

/** A second person signs and releases a submitted run; answers its new lock version. */
export async function releaseRun(t: TestApp, id: string, reviewer: string, version: number): Promise<number> {
  const res = await runAction(t, id, 'release', reviewer, { password: DEMO_PASSWORD, version }).expect(200);
  return res.body.lockVersion as number;
}
