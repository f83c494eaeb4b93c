import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

describe('sign-in and roles', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp({ LOGIN_FAILURES_PER_ACCOUNT: '3', LOGIN_FAILURES_PER_ADDRESS: '50' });
  });
  afterAll(() => t.close());

  it('should answer the public health check without a token', async () => {
    await t.http().get('/api/health').expect(200, { status: 'ok' });
  });

  it('should sign in a demo user and return a token with the user and roles', async () => {
    const res = await t.http().post('/api/auth/login').send({ email: DEMO.analyst, password: DEMO_PASSWORD }).expect(200);
    expect(res.body.accessToken).toEqual(expect.any(String));
    expect(res.body.user).toEqual({ id: expect.any(String), email: DEMO.analyst, name: 'Alma Ruiz', roles: ['analyst'] });
    const me = await t.http().get('/api/auth/me').set('Authorization', `Bearer ${res.body.accessToken}`).expect(200);
    expect(me.body).not.toHaveProperty('passwordHash');
  });

  it('should give the same answer for a wrong e-mail and a wrong password', async () => {
    const wrongPassword = await t.http().post('/api/auth/login').send({ email: DEMO.reviewer, password: 'nope-nope' }).expect(401);
    const wrongEmail = await t.http().post('/api/auth/login').send({ email: 'nobody@meritline.test', password: 'nope-nope' }).expect(401);
    expect(wrongPassword.body).toEqual(wrongEmail.body);
    expect(wrongPassword.body.message).toBe('E-mail or password is incorrect.');
  });

  it('should throttle an account after repeated failures, even for the right password, and not slow successful sign-ins', async () => {
    for (let i = 0; i < 5; i++) await t.http().post('/api/auth/login').send({ email: DEMO.quality, password: DEMO_PASSWORD }).expect(200);
    for (let i = 0; i < 3; i++)
      await t.http().post('/api/auth/login').send({ email: DEMO.analyst2, password: 'wrong-password' }).expect(401);
    const blocked = await t.http().post('/api/auth/login').send({ email: DEMO.analyst2, password: DEMO_PASSWORD }).expect(429);
    expect(blocked.body.message).toMatch(/too many failed sign-in attempts/i);
    await t.http().post('/api/auth/login').send({ email: DEMO.quality, password: DEMO_PASSWORD }).expect(200);
  });

  it('should refuse the admin routes without a token (401) and for every role but admin (403)', async () => {
    await t.http().get('/api/users').expect(401);
    await t.http().get('/api/outbox').expect(401);
    for (const email of [DEMO.analyst, DEMO.reviewer, DEMO.quality]) {
      const token = await t.tokenFor(email);
      await t.http().get('/api/users').set('Authorization', `Bearer ${token}`).expect(403);
      await t.http().get('/api/outbox').set('Authorization', `Bearer ${token}`).expect(403);
      await t
        .http()
        .post('/api/users/invitations')
        .set('Authorization', `Bearer ${token}`)
        .send({ email: 'x@y.test', name: 'X', roles: ['analyst'] })
        .expect(403);
    }
    const admin = await t.tokenFor(DEMO.admin);
    const users = await t.http().get('/api/users').set('Authorization', `Bearer ${admin}`).expect(200);
    expect(users.body.map((u: { email: string }) => u.email)).toContain(DEMO.analyst);
    expect(JSON.stringify(users.body)).not.toMatch(/password/i);
  });

  it('should refuse a forged or malformed token', async () => {
    await t.http().get('/api/auth/me').set('Authorization', 'Bearer not.a.token').expect(401);
  });

  it('should e-mail an invitation whose one-time link sets a password and signs the new user in', async () => {
    const admin = await t.tokenFor(DEMO.admin);
    const invited = await t
      .http()
      .post('/api/users/invitations')
      .set('Authorization', `Bearer ${admin}`)
      .send({ email: 'Dana.Fischer@meritline.test', name: 'Dana Fischer', roles: ['analyst', 'reviewer'] })
      .expect(201);
    expect(invited.body).toMatchObject({ email: 'dana.fischer@meritline.test', invitationPending: true, roles: ['analyst', 'reviewer'] });

    const outbox = await t.http().get('/api/outbox').set('Authorization', `Bearer ${admin}`).expect(200);
    const mail = outbox.body.find((m: { to: string[] }) => m.to.includes('dana.fischer@meritline.test'));
    expect(mail.subject).toMatch(/Meritline account/);
    const token = /accept-invitation\?token=([\w-]+)/.exec(mail.text)?.[1];
    expect(token).toBeTruthy();

    await t.http().post('/api/auth/login').send({ email: 'dana.fischer@meritline.test', password: 'a-good-password-1' }).expect(401);
    const accepted = await t
      .http()
      .post('/api/auth/accept-invitation')
      .send({ token, name: 'Dana Fischer', password: 'a-good-password-1' })
      .expect(200);
    expect(accepted.body.user.roles).toEqual(['analyst', 'reviewer']);
    await t.http().post('/api/auth/login').send({ email: 'dana.fischer@meritline.test', password: 'a-good-password-1' }).expect(200);
    await t.http().post('/api/auth/accept-invitation').send({ token, name: 'Again', password: 'another-password-2' }).expect(400);
  });

  it('should refuse a second invitation to the same e-mail with a field message', async () => {
    const admin = await t.tokenFor(DEMO.admin);
    const res = await t
      .http()
      .post('/api/users/invitations')
      .set('Authorization', `Bearer ${admin}`)
      .send({ email: DEMO.analyst, name: 'Twin', roles: ['analyst'] })
      .expect(409);
    expect(res.body.errors[0].field).toBe('email');
  });

  it('should let an admin change roles and deactivate a user, who can then no longer sign in', async () => {
    const admin = await t.tokenFor(DEMO.admin);
    const users = await t.http().get('/api/users').set('Authorization', `Bearer ${admin}`).expect(200);
    const dana = users.body.find((u: { email: string }) => u.email === 'dana.fischer@meritline.test');
    const updated = await t
      .http()
      .patch(`/api/users/${dana.id}`)
      .set('Authorization', `Bearer ${admin}`)
      .send({ roles: ['reviewer'] })
      .expect(200);
    expect(updated.body.roles).toEqual(['reviewer']);
    await t.http().patch(`/api/users/${dana.id}`).set('Authorization', `Bearer ${admin}`).send({ active: false }).expect(200);
    await t.http().post('/api/auth/login').send({ email: 'dana.fischer@meritline.test', password: 'a-good-password-1' }).expect(401);
    const self = users.body.find((u: { email: string }) => u.email === DEMO.admin);
    await t.http().patch(`/api/users/${self.id}`).set('Authorization', `Bearer ${admin}`).send({ active: false }).expect(403);
  });

  it('should let every user change their own password after re-entering the current one', async () => {
    const token = await t.tokenFor(DEMO.reviewer);
    await t
      .http()
      .post('/api/auth/change-password')
      .set('Authorization', `Bearer ${token}`)
      .send({ currentPassword: 'wrong', newPassword: 'a-new-password-9' })
      .expect(422);
    await t
      .http()
      .post('/api/auth/change-password')
      .set('Authorization', `Bearer ${token}`)
      .send({ currentPassword: DEMO_PASSWORD, newPassword: 'short' })
      .expect(422);
    await t
      .http()
      .post('/api/auth/change-password')
      .set('Authorization', `Bearer ${token}`)
      .send({ currentPassword: DEMO_PASSWORD, newPassword: 'a-new-password-9' })
      .expect(204);
    await t.http().post('/api/auth/login').send({ email: DEMO.reviewer, password: 'a-new-password-9' }).expect(200);
  });

  it('should record sign-ins and failed sign-ins in an intact audit chain', async () => {
    const quality = await t.tokenFor(DEMO.quality);
    const verify = await t.http().get('/api/audit/verify').set('Authorization', `Bearer ${quality}`).expect(200);
    expect(verify.body).toMatchObject({ ok: true });
    expect(verify.body.rows).toBeGreaterThan(5);
    for (const action of ['auth.signed-in', 'auth.sign-in-failed', 'user.invited']) {
      const entries = await t.http().get(`/api/audit?action=${action}`).set('Authorization', `Bearer ${quality}`).expect(200);
      expect(entries.body.total).toBeGreaterThan(0);
      expect(entries.body.items[0]).toMatchObject({ action, entity: 'user' });
    }
    const analyst = await t.tokenFor(DEMO.analyst);
    await t.http().get('/api/audit/verify').set('Authorization', `Bearer ${analyst}`).expect(403);
  });
});

describe('bad input on the foundation routes', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('should answer malformed JSON with 400 and a plain message', async () => {
    const res = await t.http().post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": "a@b.c",').expect(400);
    expect(res.body).toEqual({ statusCode: 400, message: expect.stringMatching(/JSON/) });
  });

  it('should answer missing fields with 422 and one message per field', async () => {
    const res = await t.http().post('/api/auth/login').send({}).expect(422);
    expect(res.body.errors.map((e: { field: string }) => e.field).sort()).toEqual(['email', 'password']);
  });

  it('should answer wrong types, unknown roles, unknown fields and over-long strings with 422', async () => {
    const admin = await t.tokenFor(DEMO.admin);
    const auth = { Authorization: `Bearer ${admin}` };
    const wrongTypes = await t
      .http()
      .post('/api/auth/login')
      .send({ email: 42, password: ['x'] })
      .expect(422);
    expect(wrongTypes.body.errors).toHaveLength(2);
    const badRole = await t
      .http()
      .post('/api/users/invitations')
      .set(auth)
      .send({ email: 'r@meritline.test', name: 'R', roles: ['superuser'] })
      .expect(422);
    expect(badRole.body.errors[0]).toMatchObject({ field: 'roles' });
    const tooLong = await t
      .http()
      .post('/api/users/invitations')
      .set(auth)
      .send({ email: 'l@meritline.test', name: 'x'.repeat(500), roles: ['analyst'] })
      .expect(422);
    expect(tooLong.body.errors[0]).toMatchObject({ field: 'name', code: 'maxLength' });
    await t
      .http()
      .post('/api/users/invitations')
      .set(auth)
      .send({ email: 'u@meritline.test', name: 'U', roles: ['analyst'], admin: true })
      .expect(422);
    await t.http().patch('/api/users/not-a-uuid').set(auth).send({ active: false }).expect(400);
    await t.http().patch('/api/users/00000000-0000-4000-8000-000000000000').set(auth).send({ active: false }).expect(404);
    const users = await t.http().get('/api/users').set(auth).expect(200);
    expect(users.body.map((u: { email: string }) => u.email)).not.toContain('l@meritline.test');
  });

  it('should answer an over-size body with 413', async () => {
    await t
      .http()
      .post('/api/auth/login')
      .send({ email: 'a@b.c', password: 'x'.repeat(6 * 1024 * 1024) })
      .expect(413);
  });

  it('should answer unknown API routes with a JSON 404', async () => {
    const token = await t.tokenFor(DEMO.analyst);
    const res = await t.http().get('/api/nothing-here').set('Authorization', `Bearer ${token}`).expect(404);
    expect(res.body.statusCode).toBe(404);
  });
});
