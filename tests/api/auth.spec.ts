import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { emailSentSchema, sessionSchema, userSchema } from '@batchproof/shared';
import { BUILT_PASSWORD, buildWorkshop, uniqueEmail } from '../support/workshop-builder';
import { firstLink } from '../support/mail-catcher';
import {
  startApiHarness,
  TEST_APP_URL,
  TEST_JWT_SECRET,
  type ApiHarness,
} from '../support/api-harness';

let h: ApiHarness;
beforeAll(async () => {
  h = await startApiHarness({ rateLimits: { signInPerAccount: 5 } });
});
afterAll(() => h.close());

const refreshCookie = (res: request.Response) =>
  ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('bp_refresh='));

/** The token in the first mail to `email`, from its link's part after `path` (e.g. '/confirm-sign-up/'). */
async function linkToken(email: string, path: string) {
  return decodeURIComponent(firstLink(await h.mail.waitFor(email)).split(path)[1]!);
}

describe('POST /api/auth/sign-up and /sign-up/confirm', () => {
  it('e-mails a link; the link creates the workshop and its owner and answers with a session', async () => {
    const email = uniqueEmail('founder');
    const res = await request(h.app).post('/api/auth/sign-up').send({
      workshopName: 'Saltmarsh Soapery',
      name: 'Pell Anders',
      email: email.toUpperCase(),
      password: 'long-enough-pass',
    });
    expect(res.status).toBe(202);
    expect(emailSentSchema.parse(res.body).message).toContain(email);
    expect(refreshCookie(res)).toBeUndefined();

    const mail = await h.mail.waitFor(email);
    expect(mail.subject).toContain('Saltmarsh Soapery');
    const token = await linkToken(email, '/confirm-sign-up/');
    const confirmed = await request(h.app).post('/api/auth/sign-up/confirm').send({ token });
    expect(confirmed.status).toBe(201);
    const session = sessionSchema.parse(confirmed.body);
    expect(session.user).toMatchObject({
      email,
      role: 'owner',
      workshop: { name: 'Saltmarsh Soapery' },
    });
    expect(refreshCookie(confirmed)).toMatch(/HttpOnly/i);
    const me = await request(h.app)
      .get('/api/me')
      .set('Authorization', `Bearer ${session.accessToken}`);
    expect(userSchema.parse(me.body).id).toBe(session.user.id);

    const again = await request(h.app).post('/api/auth/sign-up/confirm').send({ token });
    expect(again.status).toBe(400);
    expect(again.body.error.fieldErrors.token).toBeDefined();
  });

  it('when the body is empty, responds 400 with a message for every field', async () => {
    const res = await request(h.app).post('/api/auth/sign-up').send({});
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual([
      'email',
      'name',
      'password',
      'workshopName',
    ]);
  });

  it('when the password is short and the e-mail malformed, names both fields', async () => {
    const res = await request(h.app)
      .post('/api/auth/sign-up')
      .send({ workshopName: 'W', name: 'N', email: 'not-an-email', password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.email[0]).toMatch(/valid e-mail/i);
    expect(res.body.error.fieldErrors.password[0]).toMatch(/at least 10/i);
  });

  it('when the e-mail is taken, answers exactly as for a new address and e-mails the owner instead', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const taken = w.members.owner.email;
    const fresh = uniqueEmail('fresh');
    const body = { workshopName: 'Two', name: 'Second', password: 'another-password' };
    const forTaken = await request(h.app)
      .post('/api/auth/sign-up')
      .send({ ...body, email: taken });
    const forFresh = await request(h.app)
      .post('/api/auth/sign-up')
      .send({ ...body, email: fresh });
    expect(forTaken.status).toBe(forFresh.status);
    expect(forTaken.body.message.replace(taken, '<e-mail>')).toBe(
      forFresh.body.message.replace(fresh, '<e-mail>'),
    );
    expect(Object.keys(forTaken.headers).sort()).toEqual(Object.keys(forFresh.headers).sort());

    const note = await h.mail.waitFor(taken);
    expect(note.subject).toMatch(/already exists/i);
    expect(firstLink(note)).toBe(`${TEST_APP_URL}/reset-password`);
    const signIn = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email: taken, password: BUILT_PASSWORD });
    expect(signIn.status).toBe(200);
    expect(signIn.body.user.workshop.name).toBe(w.name);
  });

  it('when two confirmed links name one e-mail, the second answers 409 and keeps the first account', async () => {
    const email = uniqueEmail('twice');
    const body = { workshopName: 'First', name: 'Ada', email, password: 'long-enough-pass' };
    await request(h.app).post('/api/auth/sign-up').send(body);
    const first = await linkToken(email, '/confirm-sign-up/');
    h.mail.received.splice(0, h.mail.received.length);
    await request(h.app)
      .post('/api/auth/sign-up')
      .send({ ...body, workshopName: 'Second' });
    const second = await linkToken(email, '/confirm-sign-up/');
    expect(
      (await request(h.app).post('/api/auth/sign-up/confirm').send({ token: first })).status,
    ).toBe(201);
    const res = await request(h.app).post('/api/auth/sign-up/confirm').send({ token: second });
    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors.email).toBeDefined();
  });

  it('refuses a password of 40 accented letters: 40 characters, but 80 bytes past bcrypt’s 72', async () => {
    const res = await request(h.app)
      .post('/api/auth/sign-up')
      .send({ workshopName: 'W', name: 'N', email: uniqueEmail(), password: 'é'.repeat(40) });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.password[0]).toMatch(/at most 72 bytes/);
  });

  it('when the body is not JSON, responds 400 in the error envelope', async () => {
    const res = await request(h.app)
      .post('/api/auth/sign-up')
      .set('Content-Type', 'application/json')
      .send('{oops');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
  });
});

describe('POST /api/auth/sign-in, /refresh and /sign-out', () => {
  it('signs in case-insensitively, rotates the refresh token, and refuses the spent one', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['formulator'] });
    const email = w.members.formulator.email;
    const signIn = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email: ` ${email.toUpperCase()} `, password: BUILT_PASSWORD });
    expect(signIn.status).toBe(200);
    expect(signIn.body.user.role).toBe('formulator');
    const first = refreshCookie(signIn)!.split(';')[0]!;

    const refreshed = await request(h.app).post('/api/auth/refresh').set('Cookie', first);
    expect(refreshed.status).toBe(200);
    expect(sessionSchema.parse(refreshed.body).user.email).toBe(email);
    const second = refreshCookie(refreshed)!.split(';')[0]!;
    expect(second).not.toBe(first);

    const replay = await request(h.app).post('/api/auth/refresh').set('Cookie', first);
    expect(replay.status).toBe(401);

    const out = await request(h.app).post('/api/auth/sign-out').set('Cookie', second);
    expect(out.status).toBe(204);
    expect((await request(h.app).post('/api/auth/refresh').set('Cookie', second)).status).toBe(401);
  });

  it('with a wrong password, responds 401 without saying which part was wrong', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email: w.members.viewer.email, password: 'wrong-password' });
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/do not match/);
  });

  it('with no refresh cookie, /refresh responds 401', async () => {
    expect((await request(h.app).post('/api/auth/refresh')).status).toBe(401);
  });

  it('after too many attempts for one e-mail, responds 429 in the envelope', async () => {
    const email = uniqueEmail('target');
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      statuses.push(
        (
          await request(h.app)
            .post('/api/auth/sign-in')
            .send({ email, password: 'guess-' + i })
        ).status,
      );
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    const last = await request(h.app).post('/api/auth/sign-in').send({ email, password: 'guess' });
    expect(last.status).toBe(429);
    expect(last.body.error.code).toBe('rate_limited');
  });

  it('when fields are missing, responds 400 with fieldErrors', async () => {
    const res = await request(h.app).post('/api/auth/sign-in').send({ email: 'x' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(['email', 'password']);
  });
});

describe('invitations by e-mail', () => {
  it('the owner invites, the mail arrives over SMTP, and the invitee joins with the invited role', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const email = uniqueEmail('helper');
    const created = await request(h.app)
      .post('/api/members/invitations')
      .set('Authorization', `Bearer ${w.members.owner.token}`)
      .send({ email, role: 'production' });
    expect(created.status).toBe(201);

    const mail = await h.mail.waitFor(email);
    expect(mail.subject).toContain(w.name);
    const link = firstLink(mail);
    const token = decodeURIComponent(link.split('/accept-invite/')[1]!);

    const preview = await request(h.app).get(`/api/auth/invitations/${encodeURIComponent(token)}`);
    expect(preview.body).toMatchObject({
      email,
      role: 'production',
      workshopName: w.name,
      existingAccount: false,
    });

    const accepted = await request(h.app)
      .post('/api/auth/invitations/accept')
      .send({ token, name: 'Wren Halloway', password: 'invited-password' });
    expect(accepted.status).toBe(201);
    expect(accepted.body.user).toMatchObject({ email, role: 'production', workshop: { id: w.id } });

    const again = await request(h.app)
      .post('/api/auth/invitations/accept')
      .send({ token, name: 'Again', password: 'invited-password' });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation_used');

    const signIn = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'invited-password' });
    expect(signIn.body.user.role).toBe('production');
  });

  it('inviting an e-mail that is already a member of this workshop responds 409 with fieldErrors.email', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'viewer'] });
    const res = await request(h.app)
      .post('/api/members/invitations')
      .set('Authorization', `Bearer ${w.members.owner.token}`)
      .send({ email: w.members.viewer.email, role: 'viewer' });
    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors.email).toBeDefined();
  });

  it('an invitation with an unknown role responds 400 with fieldErrors.role', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const res = await request(h.app)
      .post('/api/members/invitations')
      .set('Authorization', `Bearer ${w.members.owner.token}`)
      .send({ email: uniqueEmail(), role: 'admin' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.role).toBeDefined();
  });

  it('accepting with a bad body responds 400 with field errors', async () => {
    const res = await request(h.app)
      .post('/api/auth/invitations/accept')
      .send({ token: 'short', password: 'x' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual(['name', 'password', 'token']);
  });
});

describe('password reset by e-mail', () => {
  it('sends a one-time link that sets a new password and ends other sessions', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const email = w.members.viewer.email;
    const signIn = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email, password: BUILT_PASSWORD });
    const oldCookie = refreshCookie(signIn)!.split(';')[0]!;

    const asked = await request(h.app).post('/api/auth/password-reset/request').send({ email });
    expect(asked.status).toBe(202);
    const token = decodeURIComponent(
      firstLink(await h.mail.waitFor(email)).split('/reset-password/')[1]!,
    );

    const done = await request(h.app)
      .post('/api/auth/password-reset/complete')
      .send({ token, password: 'a-brand-new-pass' });
    expect(done.status).toBe(204);
    expect(
      (await request(h.app).post('/api/auth/sign-in').send({ email, password: BUILT_PASSWORD }))
        .status,
    ).toBe(401);
    expect(
      (await request(h.app).post('/api/auth/sign-in').send({ email, password: 'a-brand-new-pass' }))
        .status,
    ).toBe(200);
    expect((await request(h.app).post('/api/auth/refresh').set('Cookie', oldCookie)).status).toBe(
      401,
    );

    const reuse = await request(h.app)
      .post('/api/auth/password-reset/complete')
      .send({ token, password: 'yet-another-pass' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error.fieldErrors.token).toBeDefined();
  });

  it('answers 202 for an unknown e-mail and sends nothing', async () => {
    const email = uniqueEmail('nobody');
    const res = await request(h.app).post('/api/auth/password-reset/request').send({ email });
    expect(res.status).toBe(202);
    await expect(h.mail.waitFor(email, 300)).rejects.toThrow(/No e-mail/);
  });

  it('with a malformed e-mail responds 400 with fieldErrors.email', async () => {
    const res = await request(h.app)
      .post('/api/auth/password-reset/request')
      .send({ email: 'nope' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.email).toBeDefined();
  });
});

describe('GET /api/health and unknown routes', () => {
  it('reports the database as up', async () => {
    const res = await request(h.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'ok', database: 'up' });
  });

  it('answers an unknown API path with 404 in the envelope', async () => {
    const res = await request(h.app).get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
