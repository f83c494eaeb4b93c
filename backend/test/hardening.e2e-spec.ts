import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditService, auditHash } from '../src/audit/audit.service.js';
import { AuditEntry as AuditEntryEntity } from '../src/audit/audit-entry.entity.js';
import { toCsv } from '../src/common/csv.js';
import { bearer, createStudy, dataSourceOf, queryDatabase, withDatabase } from './support/review-fixtures.js';
import { createTestApp, DEMO, postgresServerUrl, type TestApp } from './support/test-app.js';

describe('hardening against hostile input', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const raw = (path: string, body: string, token?: string) => {
    const req = t.http().post(path).set('Content-Type', 'application/json');
    if (token) req.set('Authorization', `Bearer ${token}`);
    return req.send(body);
  };

  it('should refuse an unpaired surrogate in a login e-mail with 422 and the field, writing nothing to the audit trail', async () => {
    const before = (await queryDatabase<{ n: number }>(t, 'SELECT COUNT(*) AS n FROM audit_entries'))[0].n;
    const res = await raw('/api/auth/login', '{"email":"\\ud800x","password":"x"}').expect(422);
    expect(res.body.errors[0]).toMatchObject({ field: 'email', code: 'unpairedSurrogate' });
    expect((await queryDatabase<{ n: number }>(t, 'SELECT COUNT(*) AS n FROM audit_entries'))[0].n).toBe(before);
  });

  it('should refuse an unpaired surrogate deep in a body and name its path', async () => {
    const token = await t.tokenFor(DEMO.analyst);
    const res = await raw('/api/studies', '{"name":"x","data":{"rows":[{"a":1},{"b":"ok \\udc00 done"}]}}', token).expect(422);
    expect(res.body.errors[0].field).toBe('data.rows[1].b');
  });

  it('should say in words why an unreadable body or a missing session is refused, in the one error body', async () => {
    const token = await t.tokenFor(DEMO.analyst);
    const post = () => t.http().post('/api/evaluate').set('Authorization', `Bearer ${token}`);
    const malformed = await post().set('Content-Type', 'application/json').send('{"a":').expect(400);
    expect(malformed.body.message).toMatch(/^The request body is not valid JSON: /);
    const compressed = await post().set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send('{"a":1}').expect(400);
    expect(compressed.body).toMatchObject({
      statusCode: 400,
      message: expect.stringMatching(/cannot be decompressed as its Content-Encoding/),
    });
    const latin1 = await post().set('Content-Type', 'application/json; charset=latin1').send('{"a":1}').expect(415);
    expect(latin1.body.message).toMatch(/UTF-8/);
    const large = await post()
      .set('Content-Type', 'application/json')
      .send(`{"a":"${'x'.repeat(5_300_000)}"}`)
      .expect(413);
    expect(large.body.message).toBe('The request body is larger than the 5 MB allowed.');
    for (const authorization of [undefined, 'Bearer not-a-token']) {
      const req = t.http().post('/api/evaluate');
      const res = await (authorization ? req.set('Authorization', authorization) : req).send({}).expect(401);
      expect(res.body).toEqual({ statusCode: 401, message: 'Sign in first: the request carries no valid session token.' });
    }
  });

  it('should keep a properly paired surrogate (an emoji) and accept it', async () => {
    const res = await raw('/api/auth/login', JSON.stringify({ email: 'nobody😀@meritline.test', password: 'x' }));
    expect(res.status).toBe(401);
  });

  it('should refuse numbers beyond the range of a double with 422 and the field', async () => {
    const token = await t.tokenFor(DEMO.analyst);
    for (const literal of ['1e309', '9'.repeat(400)]) {
      const res = await raw('/api/studies', `{"name":"x","data":{"levels":[${literal}]}}`, token).expect(422);
      expect(res.body.errors[0]).toMatchObject({ field: 'data.levels[0]', code: 'numberOutOfRange' });
    }
    const study = await createStudy(t, { author: DEMO.analyst });
    const res = await t
      .http()
      .patch(`/api/studies/${study.id}`)
      .set('Authorization', `Bearer ${token}`)
      .set('Content-Type', 'application/json')
      .send('{"data":{"x":-1e309}}')
      .expect(422);
    expect(res.body.errors[0].field).toBe('data.x');
  });

  it('should refuse JSON nested 3,000 levels deep with 422 instead of failing', async () => {
    const token = await t.tokenFor(DEMO.analyst);
    const deep = '['.repeat(3000) + ']'.repeat(3000);
    for (const path of ['/api/studies', '/api/auth/login']) {
      const res = await raw(path, `{"data":${deep}}`, token).expect(422);
      expect(res.body.errors[0].code).toBe('tooDeep');
    }
  });

  it('should normalise text to NFC so what is stored is what was hashed', async () => {
    const admin = bearer(await t.tokenFor(DEMO.admin));
    const decomposed = 'Jose\u0301 Nun\u0303ez';
    const res = await t
      .http()
      .post('/api/users/invitations')
      .set(admin)
      .send({ email: 'nfc@meritline.test', name: decomposed, roles: ['analyst'] });
    expect(res.status).toBeLessThan(300);
    expect(res.body.name).toBe(decomposed.normalize('NFC'));
  });

  it('should not let an administrator change the roles of its own account', async () => {
    const admin = bearer(await t.tokenFor(DEMO.admin));
    const users = (await t.http().get('/api/users').set(admin).expect(200)).body as { id: string; email: string; roles: string[] }[];
    const self = users.find((u) => u.email === DEMO.admin)!;
    const res = await t
      .http()
      .patch(`/api/users/${self.id}`)
      .set(admin)
      .send({ roles: [...self.roles, 'reviewer', 'quality_manager'] })
      .expect(403);
    expect(res.body.message).toMatch(/another administrator/i);
  });

  it('should commit durably: SQLite with synchronous=FULL (2) under WAL, PostgreSQL with synchronous_commit on', async () => {
    if (postgresServerUrl) {
      const [setting] = await dataSourceOf(t).query('SHOW synchronous_commit');
      expect(setting.synchronous_commit).toBe('on');
      return;
    }
    const [row] = await dataSourceOf(t).query('PRAGMA synchronous');
    expect(row.synchronous).toBe(2);
  });

  it('should report every audit entry edited in the database file, not only the first', async () => {
    await withDatabase(t, async (db) => {
      expect((await db.get<{ n: number }>('SELECT COUNT(*) AS n FROM audit_entries'))!.n).toBeGreaterThanOrEqual(3);
      await db.run("UPDATE audit_entries SET reason = 'x' WHERE seq IN (1, 3)");
    });
    const quality = bearer(await t.tokenFor(DEMO.quality));
    const res = await t.http().get('/api/audit/verify').set(quality).expect(200);
    expect(res.body).toMatchObject({ ok: false, brokenAt: 1 });
    expect(res.body.broken.map((b: { seq: number }) => b.seq)).toEqual([1, 3]);
  });
});

describe('CSV cells that a spreadsheet would run as a formula', () => {
  // OWASP "CSV Injection" guidance: prefix cells starting with = + - @ tab or CR with a single quote.
  it('should prefix such text cells with a single quote and leave numbers alone', () => {
    const csv = toCsv([{ a: '=HYPERLINK("x")', b: '+1', c: '-2', d: '@SUM(A1)', e: '\tx', f: '\rx', g: -0.5, h: 'plain' }]);
    const line = csv.replace(/^\uFEFF/, '').split('\r\n')[1];
    expect(line).toBe(`"'=HYPERLINK(""x"")","'+1","'-2","'@SUM(A1)","'\tx","'\rx",-0.5,plain`);
  });
});

describe('who may take part in a study discussion', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('should refuse comments from users who are neither an author nor a reviewer, and any change after approval', async () => {
    const reviewer = bearer(await t.tokenFor(DEMO.reviewer));
    const outsider = bearer(await t.tokenFor(DEMO.analyst2));
    const author = bearer(await t.tokenFor(DEMO.analyst));
    const open = await createStudy(t, { author: DEMO.analyst, status: 'submitted' });
    const comment = await t
      .http()
      .post(`/api/studies/${open.id}/comments`)
      .set(reviewer)
      .send({ section: 'standards', body: 'Check level 3.' })
      .expect(201);
    await t
      .http()
      .post(`/api/studies/${open.id}/comments`)
      .set(author)
      .send({ section: 'standards', threadId: comment.body.id, body: 'Done.' })
      .expect(201);
    const denied = await t
      .http()
      .post(`/api/studies/${open.id}/comments`)
      .set(outsider)
      .send({ section: 'standards', body: 'Hi' })
      .expect(403);
    expect(denied.body.message).toMatch(/authors of this study/);
    await t.http().patch(`/api/studies/${open.id}/comments/${comment.body.id}`).set(outsider).send({ resolved: true }).expect(403);
    await t.http().patch(`/api/studies/${open.id}/comments/${comment.body.id}`).set(author).send({ resolved: true }).expect(200);

    const approved = await createStudy(t, { author: DEMO.analyst, status: 'approved' });
    const closed = await t
      .http()
      .post(`/api/studies/${approved.id}/comments`)
      .set(reviewer)
      .send({ section: 'standards', body: 'Late.' })
      .expect(409);
    expect(closed.body.message).toMatch(/approved/);
  });
});

describe('security headers', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  // OWASP Secure Headers Project recommendations (common practice).
  it('should send a strict content security policy, nosniff, a referrer policy and no X-Powered-By', async () => {
    const res = await t.http().get('/api/health');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });

  it('should send HSTS only when the request came over TLS through the trusted proxy', async () => {
    const res = await t.http().get('/api/health').set('X-Forwarded-Proto', 'https');
    expect(res.headers['strict-transport-security']).toMatch(/max-age=31536000/);
  });
});

describe('null for optional fields', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('should answer 422 with the field for null in a user update, changing nothing', async () => {
    const admin = bearer(await t.tokenFor(DEMO.admin));
    const users = (await t.http().get('/api/users').set(admin).expect(200)).body as { id: string; email: string; name: string }[];
    const other = users.find((u) => u.email === DEMO.analyst2)!;
    for (const field of ['name', 'roles', 'active']) {
      const res = await t
        .http()
        .patch(`/api/users/${other.id}`)
        .set(admin)
        .send({ [field]: null })
        .expect(422);
      expect(res.body.errors[0].field).toBe(field);
    }
    const after = (await t.http().get('/api/users').set(admin).expect(200)).body as { id: string; name: string }[];
    expect(after.find((u) => u.id === other.id)!.name).toBe(other.name);
  });

  it('should name a field whose key is empty when refusing it as unknown', async () => {
    const admin = bearer(await t.tokenFor(DEMO.admin));
    const res = await t.http().put('/api/settings/session').set(admin).send({ idleMinutes: 30, '': 1 }).expect(422);
    expect(res.body.errors).toEqual([
      { field: '""', code: 'whitelistValidation', message: '"" is not a field of this request; leave it out.' },
    ]);
  });

  it('should refuse an unpaired surrogate in an invitation e-mail with 422', async () => {
    const admin = await t.tokenFor(DEMO.admin);
    const res = await t
      .http()
      .post('/api/users/invitations')
      .set('Authorization', `Bearer ${admin}`)
      .set('Content-Type', 'application/json')
      .send('{"email":"a\\ud800@meritline.test","name":"A","roles":["analyst"]}')
      .expect(422);
    expect(res.body.errors[0].field).toBe('email');
  });
});

describe('the audit chain anchored by signed checkpoints', () => {
  let t: TestApp;
  let quality: Record<string, string>;
  beforeAll(async () => {
    t = await createTestApp();
    quality = bearer(await t.tokenFor(DEMO.quality));
  });
  afterAll(() => t.close());

  // What someone with write access to the database file would do: edit a row and recompute every hash after it.
  const rechain = async (fromSeq: number, edit: string) => {
    await withDatabase(t, (db) => db.run(edit));
    const entries = await dataSourceOf(t)
      .getRepository(AuditEntryEntity)
      .find({ order: { seq: 'ASC' } });
    await withDatabase(t, async (db) => {
      let prev = entries[fromSeq - 2].hash;
      for (const entry of entries.slice(fromSeq - 1)) {
        const hash = auditHash({ ...entry, prevHash: prev });
        await db.run('UPDATE audit_entries SET prev_hash = ?, hash = ? WHERE seq = ?', prev, hash, entry.seq);
        prev = hash;
      }
    });
  };

  it('should detect a row edited with the chain recomputed, against the checkpoint', async () => {
    const checkpoint = await t.app.get(AuditService).checkpoint();
    expect(checkpoint!.rows).toBeGreaterThan(3);
    await rechain(2, "UPDATE audit_entries SET reason = 'rewritten' WHERE seq = 2");
    const res = await t.http().get('/api/audit/verify').set(quality).expect(200);
    expect(res.body.ok).toBe(false);
    expect(res.body.broken.map((b: { reason: string }) => b.reason).join(' ')).toMatch(/differs from the signed checkpoint/);
  });

  it('should detect the last rows deleted, against the checkpoint', async () => {
    await withDatabase(t, async (db) => {
      const { n } = (await db.get<{ n: number }>('SELECT MAX(seq) AS n FROM audit_entries'))!;
      await db.run('DELETE FROM audit_entries WHERE seq > ?', n - 2);
    });
    const res = await t.http().get('/api/audit/verify').set(quality).expect(200);
    expect(res.body.ok).toBe(false);
    expect(res.body.broken.map((b: { reason: string }) => b.reason).join(' ')).toMatch(/entries removed/);
  });
});
