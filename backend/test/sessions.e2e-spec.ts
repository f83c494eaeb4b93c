import jwt from 'jsonwebtoken';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appConfig, type AppConfigType } from '../src/config/app.config.js';
import { UserSession } from '../src/auth/user-session.entity.js';
import { User } from '../src/users/user.entity.js';
import { createStudy, dataSourceOf, userId } from './support/review-fixtures.js';
import { createTestApp, DEMO, DEMO_PASSWORD, type TestApp } from './support/test-app.js';

interface Mail {
  id: string;
  to: string[];
  subject: string;
  text: string;
}

const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

describe('sessions, password reset, password rules and signing locks', () => {
  let t: TestApp;
  let admin: string;

  const signIn = async (email: string, password = DEMO_PASSWORD) =>
    (await t.http().post('/api/auth/login').send({ email, password }).expect(200)).body.accessToken as string;
  const outbox = async () => (await t.http().get('/api/outbox').set(bearer(admin)).expect(200)).body as Mail[];
  /** The mail the action caused, waiting for the in-process SMTP sink to store it. */
  const mailFrom = async (action: () => Promise<unknown>, to: string): Promise<Mail[]> => {
    const seen = new Set((await outbox()).map((m) => m.id));
    await action();
    for (let i = 0; i < 50; i++) {
      const fresh = (await outbox()).filter((m) => !seen.has(m.id) && m.to.includes(to));
      if (fresh.length) return fresh;
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    return [];
  };
  const linkToken = (mail: Mail, path: string) => new RegExp(`${path}\\?token=([A-Za-z0-9_-]+)`).exec(mail.text)?.[1] ?? '';
  const auditOf = async (email: string) => {
    const quality = await signIn(DEMO.quality);
    return (
      await t
        .http()
        .get(`/api/audit?record=user:${await userId(t, email)}&pageSize=200`)
        .set(bearer(quality))
        .expect(200)
    ).body.items as { action: string; reason: string | null; changes: unknown }[];
  };

  beforeAll(async () => {
    t = await createTestApp({ LOGIN_FAILURES_PER_ACCOUNT: '5', LOGIN_FAILURES_PER_ADDRESS: '100' });
    admin = await signIn(DEMO.admin);
  });
  afterAll(() => t.close());

  describe('ending sessions', () => {
    it('should refuse the token at once after sign-out, and keep other sessions of the same user', async () => {
      const first = await signIn(DEMO.analyst);
      const second = await signIn(DEMO.analyst);
      await t.http().get('/api/auth/me').set(bearer(first)).expect(200);
      await t.http().post('/api/auth/logout').set(bearer(first)).expect(204);
      const refused = await t.http().get('/api/auth/me').set(bearer(first)).expect(401);
      expect(refused.body.message).toMatch(/sign in again/i);
      await t.http().get('/api/auth/me').set(bearer(second)).expect(200);
    });

    it('should refuse every token issued before a password change', async () => {
      const old = await signIn(DEMO.reviewer);
      await t
        .http()
        .post('/api/auth/change-password')
        .set(bearer(old))
        .send({ currentPassword: DEMO_PASSWORD, newPassword: 'reviewer-rotated-pass-7' })
        .expect(204);
      await t.http().get('/api/auth/me').set(bearer(old)).expect(401);
      const fresh = await signIn(DEMO.reviewer, 'reviewer-rotated-pass-7');
      await t.http().get('/api/auth/me').set(bearer(fresh)).expect(200);
    });

    it('should end a deactivated user’s sessions at once and still refuse the old token after reactivation', async () => {
      const old = await signIn(DEMO.analyst2);
      const id = await userId(t, DEMO.analyst2);
      await t.http().patch(`/api/users/${id}`).set(bearer(admin)).send({ active: false }).expect(200);
      await t.http().get('/api/auth/me').set(bearer(old)).expect(401);
      await t.http().patch(`/api/users/${id}`).set(bearer(admin)).send({ active: true }).expect(200);
      await t.http().get('/api/auth/me').set(bearer(old)).expect(401);
      const fresh = await signIn(DEMO.analyst2);
      await t.http().get('/api/auth/me').set(bearer(fresh)).expect(200);
      const sessions = await dataSourceOf(t).getRepository(UserSession).findBy({ userId: id, endReason: 'deactivated' });
      expect(sessions.length).toBeGreaterThan(0);
    });

    it('should refuse a correctly signed token that carries no expiry', async () => {
      const token = await signIn(DEMO.quality);
      const { sub, roles, sid, ver } = jwt.decode(token) as { sub: string; roles: string[]; sid: string; ver: number };
      const secret = t.app.get<AppConfigType>(appConfig.KEY).jwtSecret;
      const forever = jwt.sign({ sub, roles, sid, ver }, secret);
      expect((jwt.decode(forever) as { exp?: number }).exp).toBeUndefined();
      await t.http().get('/api/auth/me').set(bearer(forever)).expect(401);
      await t.http().get('/api/auth/me').set(bearer(token)).expect(200);
    });

    it('should refuse a signed token whose version or session does not match the user’s own', async () => {
      const token = await signIn(DEMO.quality);
      const other = jwt.decode(admin) as { sid: string };
      const { sub, sid, ver, exp } = jwt.decode(token) as { sub: string; sid: string; ver: number; exp: number };
      const secret = t.app.get<AppConfigType>(appConfig.KEY).jwtSecret;
      for (const payload of [
        { sub, sid, ver: ver + 1, exp },
        { sub, sid: other.sid, ver, exp },
        { sub, sid: 'not-a-session', ver, exp },
      ]) {
        const refused = await t
          .http()
          .get('/api/auth/me')
          .set(bearer(jwt.sign(payload, secret)))
          .expect(401);
        expect(refused.body.message).toMatch(/sign in again/i);
      }
      await t.http().get('/api/auth/me').set(bearer(token)).expect(200);
    });

    it('should apply a role change to the very next request of a signed-in user', async () => {
      const token = await signIn(DEMO.analyst);
      const id = await userId(t, DEMO.analyst);
      await t.http().get('/api/users').set(bearer(token)).expect(403);
      await t
        .http()
        .patch(`/api/users/${id}`)
        .set(bearer(admin))
        .send({ roles: ['analyst', 'admin'] })
        .expect(200);
      await t.http().get('/api/users').set(bearer(token)).expect(200);
      expect((await t.http().get('/api/auth/me').set(bearer(token)).expect(200)).body.roles).toEqual(['analyst', 'admin']);
      await t
        .http()
        .patch(`/api/users/${id}`)
        .set(bearer(admin))
        .send({ roles: ['analyst'] })
        .expect(200);
      await t.http().get('/api/users').set(bearer(token)).expect(403);
    });
  });

  describe('idle sign-out', () => {
    it('should let every user read the idle period, only admins change it, and refuse bad values with 422', async () => {
      const analyst = await signIn(DEMO.analyst);
      expect((await t.http().get('/api/settings/session').set(bearer(analyst)).expect(200)).body).toEqual({ idleMinutes: 30 });
      await t.http().put('/api/settings/session').set(bearer(analyst)).send({ idleMinutes: 10 }).expect(403);
      const bad = await t.http().put('/api/settings/session').set(bearer(admin)).send({ idleMinutes: 0 }).expect(422);
      expect(bad.body.errors[0]).toMatchObject({ field: 'idleMinutes' });
      await t.http().put('/api/settings/session').set(bearer(admin)).send({ idleMinutes: 10 }).expect(200, { idleMinutes: 10 });
      expect((await t.http().get('/api/settings/session').set(bearer(analyst)).expect(200)).body).toEqual({ idleMinutes: 10 });
    });

    it('should refuse a token whose session was idle longer than the period', async () => {
      const token = await signIn(DEMO.analyst);
      const { sid } = jwt.decode(token) as { sid: string };
      const sessions = dataSourceOf(t).getRepository(UserSession);
      await sessions.update({ id: sid }, { lastActivityAt: new Date(Date.now() - 9 * 60_000) });
      await t.http().get('/api/auth/me').set(bearer(token)).expect(200);
      await sessions.update({ id: sid }, { lastActivityAt: new Date(Date.now() - 11 * 60_000) });
      const refused = await t.http().get('/api/auth/me').set(bearer(token)).expect(401);
      expect(refused.body.message).toMatch(/without activity/i);
      await t.http().put('/api/settings/session').set(bearer(admin)).send({ idleMinutes: 30 }).expect(200);
    });
  });

  describe('password reset by e-mail', () => {
    it('should give the same answer for a known and an unknown address, and mail only the known one', async () => {
      const known = await t.http().post('/api/auth/password-reset').send({ email: DEMO.quality }).expect(202);
      const unknown = await t.http().post('/api/auth/password-reset').send({ email: 'nobody@meritline.test' }).expect(202);
      expect(unknown.body).toEqual(known.body);
      const mails = await mailFrom(
        () => t.http().post('/api/auth/password-reset').send({ email: 'nobody-else@meritline.test' }).expect(202),
        'nobody-else@meritline.test',
      );
      expect(mails).toEqual([]);
    });

    it('should reset the password through the e-mailed one-time link, end old sessions and refuse the link a second time', async () => {
      const old = await signIn(DEMO.analyst);
      const [mail] = await mailFrom(
        () => t.http().post('/api/auth/password-reset').send({ email: DEMO.analyst }).expect(202),
        DEMO.analyst,
      );
      expect(mail.subject).toMatch(/new meritline password/i);
      const token = linkToken(mail, '/reset-password');
      expect(token.length).toBeGreaterThan(20);
      const stored = await dataSourceOf(t).getRepository(User).findOneByOrFail({ email: DEMO.analyst });
      expect(stored.passwordResetTokenHash).not.toBe(token);

      await t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'alma-fresh-start-42' }).expect(204);
      await t.http().get('/api/auth/me').set(bearer(old)).expect(401);
      await t.http().post('/api/auth/login').send({ email: DEMO.analyst, password: DEMO_PASSWORD }).expect(401);
      await signIn(DEMO.analyst, 'alma-fresh-start-42');

      const reused = await t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'alma-another-pass-43' }).expect(422);
      expect(reused.body.errors[0]).toMatchObject({ field: 'token', code: 'invalid' });
      expect(reused.body.message).toMatch(/not valid or was already used/i);

      const actions = (await auditOf(DEMO.analyst)).map((e) => e.action);
      expect(actions).toEqual(expect.arrayContaining(['auth.password-reset-requested', 'auth.password-reset-completed']));
      expect(JSON.stringify(await auditOf(DEMO.analyst))).not.toContain(token);
    });

    it('should refuse an expired link with 422', async () => {
      const [mail] = await mailFrom(
        () => t.http().post('/api/auth/password-reset').send({ email: DEMO.quality }).expect(202),
        DEMO.quality,
      );
      const token = linkToken(mail, '/reset-password');
      await dataSourceOf(t)
        .getRepository(User)
        .update({ email: DEMO.quality }, { passwordResetExpiresAt: new Date(Date.now() - 1000) });
      const res = await t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'quality-fresh-pass-1' }).expect(422);
      expect(res.body.errors[0]).toMatchObject({ field: 'token', code: 'expired' });
      expect(res.body.message).toMatch(/expired/i);
      await signIn(DEMO.quality);
    });
  });

  describe('password rules', () => {
    it('should refuse short, e-mail-like and common passwords with a message on the field', async () => {
      const [mail] = await mailFrom(() => t.http().post('/api/auth/password-reset').send({ email: DEMO.admin }).expect(202), DEMO.admin);
      const token = linkToken(mail, '/reset-password');
      const refuse = async (password: string) =>
        (await t.http().post('/api/auth/password-reset/confirm').send({ token, password }).expect(422)).body.errors[0] as {
          field: string;
          code: string;
          message: string;
        };
      expect(await refuse('short-pass1')).toMatchObject({ field: 'password', code: 'too-short', message: 'Use at least 12 characters.' });
      expect(await refuse('admin@meritline.test')).toMatchObject({ field: 'password', code: 'is-email' });
      expect(await refuse('Password1234')).toMatchObject({ field: 'password', code: 'common' });

      const analyst2 = await signIn(DEMO.analyst2);
      const change = await t
        .http()
        .post('/api/auth/change-password')
        .set(bearer(analyst2))
        .send({ currentPassword: DEMO_PASSWORD, newPassword: 'qwertyuiop123' })
        .expect(422);
      expect(change.body.errors[0]).toMatchObject({ field: 'newPassword', code: 'common' });
      const short = await t
        .http()
        .post('/api/auth/change-password')
        .set(bearer(analyst2))
        .send({ currentPassword: DEMO_PASSWORD, newPassword: 'elevenchars' })
        .expect(422);
      expect(short.body.errors[0]).toMatchObject({ field: 'newPassword', message: 'Use at least 12 characters.' });
      await t.http().get('/api/auth/me').set(bearer(analyst2)).expect(200);
    });

    it('should apply the rules when an invitation is accepted', async () => {
      const [mail] = await mailFrom(
        () =>
          t
            .http()
            .post('/api/users/invitations')
            .set(bearer(admin))
            .send({ email: 'lena.okafor@meritline.test', name: 'Lena Okafor', roles: ['analyst'] })
            .expect(201),
        'lena.okafor@meritline.test',
      );
      const token = linkToken(mail, '/accept-invitation');
      const local = await t
        .http()
        .post('/api/auth/accept-invitation')
        .send({ token, name: 'Lena Okafor', password: 'lena.okafor' })
        .expect(422);
      expect(local.body.errors[0]).toMatchObject({ field: 'password' });
      const asLocalPart = await t
        .http()
        .post('/api/auth/accept-invitation')
        .send({ token, name: 'Lena Okafor', password: 'Lena.Okafor@meritline.test' })
        .expect(422);
      expect(asLocalPart.body.errors[0]).toMatchObject({ field: 'password', code: 'is-email' });
      await t.http().post('/api/auth/accept-invitation').send({ token, name: 'Lena Okafor', password: 'a-sound-passphrase-3' }).expect(200);
    });
  });

  describe('signing with the password', () => {
    it('should lock signing after five wrong passwords, record it, and lift it from the e-mailed link', async () => {
      const email = DEMO.analyst2;
      const token = await signIn(email);
      const study = await createStudy(t, { author: email });
      const submit = (password: string) => t.http().post(`/api/studies/${study.id}/submit`).set(bearer(token)).send({ password });
      for (let i = 0; i < 4; i++) await submit('not-my-password').expect(401);
      const [mail] = await mailFrom(() => submit('not-my-password').expect(401), email);
      expect(mail.subject).toMatch(/locked/i);
      const locked = await submit(DEMO_PASSWORD).expect(429);
      expect(locked.body.message).toMatch(/signing is locked/i);
      expect((await auditOf(email)).map((e) => e.action)).toContain('signature.locked');

      const unlock = linkToken(mail, '/unlock');
      await t.http().post('/api/auth/unlock/confirm').send({ token: unlock }).expect(204);
      await t.http().post('/api/auth/unlock/confirm').send({ token: unlock }).expect(422);
      await submit(DEMO_PASSWORD).expect((res) => expect(res.status).toBeLessThan(300));
      expect((await auditOf(email)).map((e) => e.action)).toContain('auth.unlocked');
    });

    it('should mail an unlock link when sign-in locks, and the link lets the owner sign in again', async () => {
      const email = DEMO.admin;
      for (let i = 0; i < 4; i++) await t.http().post('/api/auth/login').send({ email, password: 'wrong-password-x' }).expect(401);
      const [mail] = await mailFrom(
        () => t.http().post('/api/auth/login').send({ email, password: 'wrong-password-x' }).expect(401),
        email,
      );
      await t.http().post('/api/auth/login').send({ email, password: DEMO_PASSWORD }).expect(429);
      await t
        .http()
        .post('/api/auth/unlock/confirm')
        .send({ token: linkToken(mail, '/unlock') })
        .expect(204);
      await signIn(email);
    });
  });
  describe("the browser's session cookie", () => {
    const cookieSignIn = async (email: string) => {
      const res = await t.http().post('/api/auth/login').send({ email, password: DEMO_PASSWORD }).expect(200);
      const setCookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
      const session = setCookie.find((c) => c.startsWith('meritline_session='));
      return { session: session ?? '', cookie: (session ?? '').split(';')[0], token: res.body.accessToken as string };
    };
    const fromApp = { 'X-Requested-With': 'meritline' };

    it('should keep the token where page scripts cannot read it, sent only to the API of this site', async () => {
      const { session, cookie, token } = await cookieSignIn(DEMO.analyst2);
      const attributes = session.split(';').map((a) => a.trim().toLowerCase());
      expect(cookie).toBe(`meritline_session=${token}`);
      expect(attributes).toEqual(expect.arrayContaining(['httponly', 'samesite=strict', 'path=/api']));
      expect(attributes.some((a) => a.startsWith('expires=') || a.startsWith('max-age='))).toBe(false);
      const me = await t.http().get('/api/auth/me').set('Cookie', cookie).expect(200);
      expect(me.body.email).toBe(DEMO.analyst2);
    });

    it('should refuse a change signed in by the cookie alone unless the web app sent it, and change nothing', async () => {
      const { cookie } = await cookieSignIn(DEMO.analyst2);
      const refused = await t.http().post('/api/auth/logout').set('Cookie', cookie).expect(403);
      expect(refused.body.message).toMatch(/not sent by the Meritline web app/);
      await t.http().get('/api/auth/me').set('Cookie', cookie).expect(200);

      const ended = await t.http().post('/api/auth/logout').set('Cookie', cookie).set(fromApp).expect(204);
      const cleared = ([] as string[]).concat(ended.headers['set-cookie'] ?? []).find((c) => c.startsWith('meritline_session='));
      expect(cleared).toMatch(/^meritline_session=;.*Expires=Thu, 01 Jan 1970/);
      expect(cleared).toMatch(/Path=\/api/);
      await t.http().get('/api/auth/me').set('Cookie', cookie).expect(401);
    });

    it('should read the Authorization header alone when one is sent, and refuse a forged cookie', async () => {
      const { cookie } = await cookieSignIn(DEMO.analyst2);
      await t.http().get('/api/auth/me').set('Cookie', cookie).set(bearer('forged')).expect(401);
      const forged = jwt.sign({ sub: await userId(t, DEMO.analyst2) }, 'not-the-secret');
      await t.http().get('/api/auth/me').set('Cookie', `meritline_session=${forged}`).expect(401);
      await t.http().post('/api/auth/logout').set('Cookie', 'meritline_session=forged').set(fromApp).expect(401);
    });
  });
});
