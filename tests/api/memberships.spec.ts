import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';
import { firstLink } from '../support/mail-catcher';
import { buildMaterial } from '../support/row-builders';
import {
  addMembership,
  BUILT_PASSWORD,
  buildWorkshop,
  type BuiltMember,
  type BuiltWorkshop,
} from '../support/workshop-builder';

let h: ApiHarness;
beforeAll(async () => {
  h = await startApiHarness();
});
afterAll(() => h.close());

const cookieOf = (res: request.Response) =>
  ([] as string[])
    .concat(res.headers['set-cookie'] ?? [])
    .find((c) => c.startsWith('bp_refresh='))!
    .split(';')[0]!;
const widOf = (accessToken: string) => (jwt.decode(accessToken) as { wid: string }).wid;

const signIn = (email: string, password = BUILT_PASSWORD) =>
  request(h.app).post('/api/auth/sign-in').send({ email, password });
const switchTo = (token: string, workshopId: string, cookie?: string) => {
  const req = request(h.app).post('/api/auth/workshop').set(bearer({ token }));
  return (cookie ? req.set('Cookie', cookie) : req).send({ workshopId });
};
const me = (token: string) => request(h.app).get('/api/me').set(bearer({ token }));

/**
 * Two workshops, "Alder" and "Birch" (names sorted), and one person who is the formulator of
 * Alder and the viewer of Birch, with Birch opened last.
 */
async function twoWorkshops() {
  const tag = crypto.randomUUID().slice(0, 6);
  const alder = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, {
    name: `Alder ${tag}`,
    roles: ['owner', 'formulator'],
  });
  const birch = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, {
    name: `Birch ${tag}`,
    roles: ['owner'],
  });
  const inAlder = alder.members.formulator;
  const inBirch = await addMembership(h.handle.db, TEST_JWT_SECRET, inAlder, birch.id, 'viewer', {
    lastActiveAt: new Date(),
  });
  return { alder, birch, inAlder, inBirch };
}

describe('a person in two workshops', () => {
  let alder: BuiltWorkshop;
  let birch: BuiltWorkshop;
  let inAlder: BuiltMember;
  let inBirch: BuiltMember;
  beforeAll(async () => {
    ({ alder, birch, inAlder, inBirch } = await twoWorkshops());
  });

  it('signs in to the workshop they worked in last, and every session lists both memberships', async () => {
    const res = await signIn(inAlder.email);
    expect(res.status).toBe(200);
    expect(widOf(res.body.accessToken)).toBe(birch.id);
    expect(res.body.user).toMatchObject({
      id: inAlder.id,
      role: 'viewer',
      workshop: { id: birch.id, name: birch.name },
    });
    const mine = await me(res.body.accessToken);
    expect(mine.body.memberships).toEqual([
      { workshopId: alder.id, workshopName: alder.name, role: 'formulator' },
      { workshopId: birch.id, workshopName: birch.name, role: 'viewer' },
    ]);
    expect(mine.body.workshop).toEqual({ id: birch.id, name: birch.name });
  });

  it('switches workshop: a token naming it, the role held there, and a refresh that stays there', async () => {
    const signedIn = await signIn(inAlder.email);
    const switched = await switchTo(signedIn.body.accessToken, alder.id, cookieOf(signedIn));
    expect(switched.status).toBe(200);
    expect(widOf(switched.body.accessToken)).toBe(alder.id);
    expect(switched.body.user).toMatchObject({ role: 'formulator', workshop: { id: alder.id } });
    // The presented refresh cookie is spent; the new one belongs to the switched workshop.
    expect(
      (await request(h.app).post('/api/auth/refresh').set('Cookie', cookieOf(signedIn))).status,
    ).toBe(401);
  });

  it('a refresh after switching stays in the switched workshop, and the next sign-in opens it', async () => {
    const signedIn = await signIn(inAlder.email);
    const switched = await switchTo(signedIn.body.accessToken, alder.id, cookieOf(signedIn));
    const refreshed = await request(h.app)
      .post('/api/auth/refresh')
      .set('Cookie', cookieOf(switched));
    expect(refreshed.status).toBe(200);
    expect(widOf(refreshed.body.accessToken)).toBe(alder.id);
    expect(refreshed.body.user.workshop.id).toBe(alder.id);
    expect(widOf((await signIn(inAlder.email)).body.accessToken)).toBe(alder.id);
    // Back to Birch for the other cases.
    await switchTo(refreshed.body.accessToken, birch.id);
    expect(widOf((await signIn(inAlder.email)).body.accessToken)).toBe(birch.id);
  });

  it("sees only the active workshop's records, each way", async () => {
    const alderMaterial = await buildMaterial(h.handle.db, alder.id);
    const birchMaterial = await buildMaterial(h.handle.db, birch.id);
    const list = async (token: string) =>
      (
        (await request(h.app).get('/api/materials').set(bearer({ token }))).body.items as {
          id: string;
        }[]
      ).map((m) => m.id);
    const get = (token: string, id: string) =>
      request(h.app).get(`/api/materials/${id}`).set(bearer({ token }));

    const asAlder = (await switchTo(inBirch.token, alder.id)).body.accessToken as string;
    expect((await get(asAlder, alderMaterial.id)).status).toBe(200);
    expect((await get(asAlder, birchMaterial.id)).status).toBe(404);
    expect(await list(asAlder)).toContain(alderMaterial.id);
    expect(await list(asAlder)).not.toContain(birchMaterial.id);

    const asBirch = (await switchTo(asAlder, birch.id)).body.accessToken as string;
    expect((await get(asBirch, birchMaterial.id)).status).toBe(200);
    expect((await get(asBirch, alderMaterial.id)).status).toBe(404);
    expect(await list(asBirch)).toContain(birchMaterial.id);
    expect(await list(asBirch)).not.toContain(alderMaterial.id);
  });

  it('holds the role of the active workshop: a viewer in Birch cannot write there', async () => {
    const res = await request(h.app)
      .post('/api/materials')
      .set(bearer(inBirch))
      .send({ tradeName: 'Should not exist' });
    expect(res.status).toBe(403);
  });

  it('switching to a workshop they are not a member of is a 400 field error, and changes nothing', async () => {
    const stranger = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    for (const workshopId of [stranger.id, crypto.randomUUID()]) {
      const res = await switchTo(inBirch.token, workshopId);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(res.body.error.fieldErrors.workshopId).toBeDefined();
    }
    const malformed = await switchTo(inBirch.token, 'not-a-workshop');
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fieldErrors.workshopId).toBeDefined();
    expect((await me(inBirch.token)).body.workshop.id).toBe(birch.id);
  });

  it('switching needs a signed-in caller', async () => {
    const res = await request(h.app).post('/api/auth/workshop').send({ workshopId: alder.id });
    expect(res.status).toBe(401);
  });
});

describe('removing one membership', () => {
  it("ends that workshop's tokens and refresh sessions; the other workshop still works", async () => {
    const { alder, birch, inAlder, inBirch } = await twoWorkshops();
    const birchSession = await signIn(inAlder.email);
    expect(widOf(birchSession.body.accessToken)).toBe(birch.id);

    const removed = await request(h.app)
      .delete(`/api/members/${inAlder.id}`)
      .set(bearer(birch.members.owner));
    expect(removed.status).toBe(204);

    expect((await me(inBirch.token)).status).toBe(401);
    expect((await me(birchSession.body.accessToken)).status).toBe(401);
    const refresh = await request(h.app)
      .post('/api/auth/refresh')
      .set('Cookie', cookieOf(birchSession));
    expect(refresh.status).toBe(401);

    const stillAlder = await me(inAlder.token);
    expect(stillAlder.status).toBe(200);
    expect(stillAlder.body.memberships).toEqual([
      { workshopId: alder.id, workshopName: alder.name, role: 'formulator' },
    ]);
    // Signing in now opens the one workshop left.
    expect(widOf((await signIn(inAlder.email)).body.accessToken)).toBe(alder.id);
  });

  it('removing the last membership deletes the account', async () => {
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'viewer'] });
    const res = await request(h.app)
      .delete(`/api/members/${w.members.viewer.id}`)
      .set(bearer(w.members.owner));
    expect(res.status).toBe(204);
    expect((await signIn(w.members.viewer.email)).status).toBe(401);
    const user = await h.handle.db.query.users.findFirst({
      where: (u, { eq }) => eq(u.id, w.members.viewer.id),
    });
    expect(user).toBeUndefined();
  });
});

describe('a password reset for a person in two workshops', () => {
  it('is sent, sets the new password and ends the sessions of both workshops', async () => {
    const { inAlder, inBirch } = await twoWorkshops();
    await request(h.app).post('/api/auth/password-reset/request').send({ email: inAlder.email });
    const resetMail = () =>
      h.mail.received.find((m) => m.to.includes(inAlder.email) && /reset your/i.test(m.subject));
    await vi.waitFor(() => expect(resetMail()).toBeDefined(), { timeout: 10_000 });
    const token = decodeURIComponent(firstLink(resetMail()!).split('/reset-password/')[1]!);
    const done = await request(h.app)
      .post('/api/auth/password-reset/complete')
      .send({ token, password: 'a-brand-new-pass' });
    expect(done.status).toBe(204);
    expect((await me(inAlder.token)).status).toBe(401);
    expect((await me(inBirch.token)).status).toBe(401);
    expect((await signIn(inAlder.email, 'a-brand-new-pass')).status).toBe(200);
  });
});

describe('inviting an address that already has an account', () => {
  async function invite(owner: BuiltMember, email: string, role = 'assessor') {
    const res = await request(h.app)
      .post('/api/members/invitations')
      .set(bearer(owner))
      .send({ email, role });
    await h.mail.waitFor(email);
    return { res };
  }
  const tokenFrom = (email: string) => {
    const mails = h.mail.received.filter((m) => m.to.includes(email));
    return decodeURIComponent(firstLink(mails.at(-1)!).split('/accept-invite/')[1]!);
  };
  const accept = (body: object) => request(h.app).post('/api/auth/invitations/accept').send(body);

  it('adds a membership once the account password is given, and opens the invited workshop', async () => {
    const home = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'viewer'] });
    const other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const person = home.members.viewer;

    const { res } = await invite(other.members.owner, person.email);
    expect(res.status).toBe(201);
    const token = tokenFrom(person.email);

    const preview = await request(h.app).get(`/api/auth/invitations/${encodeURIComponent(token)}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ email: person.email, existingAccount: true });

    const wrong = await accept({ token, password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(wrong.body.error.fieldErrors.password).toBeDefined();
    // The refusal says nothing about the account beyond the password being wrong.
    expect(JSON.stringify(wrong.body)).not.toContain(person.name);

    const missing = await accept({ token });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fieldErrors.password).toBeDefined();

    const accepted = await accept({ token, password: BUILT_PASSWORD });
    expect(accepted.status).toBe(201);
    expect(widOf(accepted.body.accessToken)).toBe(other.id);
    expect(accepted.body.user).toMatchObject({
      id: person.id,
      name: person.name,
      role: 'assessor',
      workshop: { id: other.id },
    });
    expect(
      (accepted.body.user.memberships as { workshopId: string }[]).map((m) => m.workshopId).sort(),
    ).toEqual([home.id, other.id].sort());
    // The account's password is unchanged and the old workshop's token still works.
    expect((await me(person.token)).status).toBe(200);
    expect((await signIn(person.email)).status).toBe(200);

    const list = await request(h.app).get('/api/members').set(bearer(other.members.owner));
    expect(list.body.items).toContainEqual(
      expect.objectContaining({ id: person.id, role: 'assessor' }),
    );
    // The link is spent.
    expect((await accept({ token, password: BUILT_PASSWORD })).status).toBe(410);
  });

  it('refuses with 409 when the account is already a member of this workshop', async () => {
    const a = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'viewer'] });
    const b = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    await addMembership(h.handle.db, TEST_JWT_SECRET, a.members.viewer, b.id, 'viewer');
    const res = await request(h.app)
      .post('/api/members/invitations')
      .set(bearer(b.members.owner))
      .send({ email: a.members.viewer.email, role: 'formulator' });
    expect(res.status).toBe(409);
    expect(res.body.error.fieldErrors.email).toBeDefined();
  });

  it('an acceptance that finds the account already a member (added meanwhile) answers 409', async () => {
    const a = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner', 'viewer'] });
    const b = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
    const person = a.members.viewer;
    expect((await invite(b.members.owner, person.email)).res.status).toBe(201);
    const token = tokenFrom(person.email);
    await addMembership(h.handle.db, TEST_JWT_SECRET, person, b.id, 'viewer');
    const res = await accept({ token, password: BUILT_PASSWORD });
    expect(res.status).toBe(409);
    // Refused as a whole: the link stays usable, the role unchanged.
    expect(
      (await request(h.app).get(`/api/auth/invitations/${encodeURIComponent(token)}`)).status,
    ).toBe(200);
  });
});

describe('rate limit of switching', () => {
  it('counts switches with refreshes per address, and answers 429 past the limit', async () => {
    const limited = await startApiHarness({ rateLimits: { refreshPerAddress: 2 } });
    try {
      const { alder, birch, inBirch } = await twoWorkshops();
      const send = (workshopId: string) =>
        request(limited.app).post('/api/auth/workshop').set(bearer(inBirch)).send({ workshopId });
      expect((await send(alder.id)).status).toBe(200);
      expect((await send(birch.id)).status).toBe(200);
      const third = await send(alder.id);
      expect(third.status).toBe(429);
      expect(third.body.error.code).toBe('rate_limited');
    } finally {
      await limited.close();
    }
  });
});
