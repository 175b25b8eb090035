import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { BUILT_PASSWORD, buildWorkshop } from '../support/workshop-builder';
import { firstLink } from '../support/mail-catcher';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';

let h: ApiHarness;
beforeAll(async () => {
  h = await startApiHarness();
});
afterAll(() => h.close());

/** Signs a member in over the API, as one device would: its access token and refresh cookie. */
async function device(email: string) {
  const res = await request(h.app)
    .post('/api/auth/sign-in')
    .send({ email, password: BUILT_PASSWORD });
  expect(res.status).toBe(200);
  const cookie = ([] as string[])
    .concat(res.headers['set-cookie'] ?? [])
    .find((c) => c.startsWith('bp_refresh='))!
    .split(';')[0]!;
  return { token: res.body.accessToken as string, cookie };
}

const me = (token: string) => request(h.app).get('/api/me').set('Authorization', `Bearer ${token}`);
const refresh = (cookie: string) => request(h.app).post('/api/auth/refresh').set('Cookie', cookie);
const cookieOf = (res: request.Response) =>
  ([] as string[])
    .concat(res.headers['set-cookie'] ?? [])
    .find((c) => c.startsWith('bp_refresh='))!
    .split(';')[0]!;

async function viewer() {
  const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
  return w.members.viewer.email;
}

/** The reset tokens of every reset mail sent to `email` so far, oldest first. */
const resetTokens = (email: string) =>
  h.mail.received
    .filter((m) => m.to.includes(email) && /reset your/i.test(m.subject))
    .map((m) => decodeURIComponent(firstLink(m).split('/reset-password/')[1]!));

describe('POST /api/auth/refresh: token families', () => {
  it('a spent refresh token presented again revokes its whole family, and only that family', async () => {
    const email = await viewer();
    const laptop = await device(email);
    const phone = await device(email);

    const rotated = await refresh(laptop.cookie);
    expect(rotated.status).toBe(200);
    const current = cookieOf(rotated);

    // Someone replays the spent token (a copy stolen before the rotation).
    expect((await refresh(laptop.cookie)).status).toBe(401);
    // The rotated token of that family is revoked with it ...
    expect((await refresh(current)).status).toBe(401);
    // ... while the other device's session, its own family, goes on.
    expect((await refresh(phone.cookie)).status).toBe(200);
  });
});

describe('POST /api/auth/sign-out-everywhere', () => {
  it('ends every session: refresh tokens are refused and outstanding access tokens fail at once', async () => {
    const email = await viewer();
    const laptop = await device(email);
    const phone = await device(email);
    expect((await me(phone.token)).status).toBe(200);

    const out = await request(h.app)
      .post('/api/auth/sign-out-everywhere')
      .set('Authorization', `Bearer ${laptop.token}`)
      .set('Cookie', laptop.cookie);
    expect(out.status).toBe(204);
    expect(cookieOf(out)).toBe('bp_refresh=');

    expect((await me(laptop.token)).status).toBe(401);
    expect((await me(phone.token)).status).toBe(401);
    expect((await refresh(laptop.cookie)).status).toBe(401);
    expect((await refresh(phone.cookie)).status).toBe(401);

    const again = await device(email);
    expect((await me(again.token)).status).toBe(200);
  });

  it('without an access token responds 401 in the envelope', async () => {
    const res = await request(h.app).post('/api/auth/sign-out-everywhere');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });
});

describe('POST /api/auth/password-reset/complete', () => {
  it('revokes every session and makes the access tokens already handed out fail at once', async () => {
    const email = await viewer();
    const before = await device(email);
    await request(h.app).post('/api/auth/password-reset/request').send({ email });
    await vi.waitFor(() => expect(resetTokens(email)).toHaveLength(1), { timeout: 10_000 });

    const done = await request(h.app)
      .post('/api/auth/password-reset/complete')
      .send({ token: resetTokens(email)[0], password: 'a-brand-new-pass' });
    expect(done.status).toBe(204);
    expect((await me(before.token)).status).toBe(401);
    expect((await refresh(before.cookie)).status).toBe(401);
  });

  it('using one reset link spends the others sent before it', async () => {
    const email = await viewer();
    for (let i = 0; i < 2; i++) {
      await request(h.app).post('/api/auth/password-reset/request').send({ email });
    }
    await vi.waitFor(() => expect(resetTokens(email)).toHaveLength(2), { timeout: 10_000 });
    const [first, second] = resetTokens(email);

    const used = await request(h.app)
      .post('/api/auth/password-reset/complete')
      .send({ token: second, password: 'the-second-link' });
    expect(used.status).toBe(204);
    const other = await request(h.app)
      .post('/api/auth/password-reset/complete')
      .send({ token: first, password: 'the-first-link' });
    expect(other.status).toBe(400);
    expect(other.body.error.fieldErrors.token).toBeDefined();
    const signIn = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email, password: 'the-second-link' });
    expect(signIn.status).toBe(200);
  });
});
