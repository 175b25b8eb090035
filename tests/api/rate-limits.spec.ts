import request from 'supertest';
import { afterEach, describe, expect, it } from 'vitest';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { BUILT_PASSWORD, buildWorkshop, uniqueEmail } from '../support/workshop-builder';

let h: ApiHarness | undefined;
afterEach(async () => {
  await h?.close();
  h = undefined;
});

const signIn = (app: ApiHarness['app'], email: string, password: string, forwardedFor?: string) => {
  const req = request(app).post('/api/auth/sign-in');
  if (forwardedFor) req.set('X-Forwarded-For', forwardedFor);
  return req.send({ email, password });
};

describe('rate limits', () => {
  it('counts failed sign-ins per address: a forged X-Forwarded-For does not make a new address', async () => {
    h = await startApiHarness({ rateLimits: { signInPerAddress: 3 } });
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      // Every attempt names another account and claims another address.
      const res = await signIn(h.app, uniqueEmail('spray'), 'guess-' + i, `203.0.113.${i + 1}`);
      statuses.push(res.status);
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
  });

  it('believes X-Forwarded-For only from a proxy the configuration names', async () => {
    h = await startApiHarness({ rateLimits: { signInPerAddress: 1 }, trustProxy: 'loopback' });
    const first = await signIn(h.app, uniqueEmail(), 'guess', '203.0.113.10');
    const otherClient = await signIn(h.app, uniqueEmail(), 'guess', '203.0.113.11');
    const sameClient = await signIn(h.app, uniqueEmail(), 'guess', '203.0.113.10');
    expect([first.status, otherClient.status, sameClient.status]).toEqual([401, 401, 429]);
  });

  it('does not count successful sign-ins against the limit', async () => {
    h = await startApiHarness({ rateLimits: { signInPerAccount: 2, signInPerAddress: 2 } });
    const w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['viewer'] });
    const email = w.members.viewer.email;
    for (let i = 0; i < 5; i++) {
      expect((await signIn(h.app, email, BUILT_PASSWORD)).status).toBe(200);
    }
    expect((await signIn(h.app, email, 'wrong-password')).status).toBe(401);
    expect((await signIn(h.app, email, BUILT_PASSWORD)).status).toBe(200);
  });

  it('limits reset requests per account, answering 429 in the envelope', async () => {
    h = await startApiHarness({ rateLimits: { passwordResetPerAccount: 2 } });
    const email = uniqueEmail('reset-target');
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) {
      statuses.push(
        (await request(h.app).post('/api/auth/password-reset/request').send({ email })).status,
      );
    }
    expect(statuses).toEqual([202, 202, 429]);
  });

  it.each([
    [
      'sign-up',
      'signUpPerAddress',
      '/api/auth/sign-up',
      { workshopName: 'W', name: 'N', password: 'long-enough-pass' },
    ],
    [
      'invitation acceptance',
      'linkTokenPerAddress',
      '/api/auth/invitations/accept',
      { token: 'x'.repeat(43), name: 'N', password: 'long-enough-pass' },
    ],
    [
      'password-reset completion',
      'linkTokenPerAddress',
      '/api/auth/password-reset/complete',
      { token: 'x'.repeat(43), password: 'long-enough-pass' },
    ],
    ['refresh', 'refreshPerAddress', '/api/auth/refresh', {}],
  ] as const)('limits %s per address', async (_what, rule, path, body) => {
    h = await startApiHarness({ rateLimits: { [rule]: 2 } });
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) {
      statuses.push(
        (
          await request(h.app)
            .post(path)
            .send({ ...body, email: uniqueEmail() })
        ).status,
      );
    }
    expect(statuses[2]).toBe(429);
    expect(statuses.slice(0, 2)).not.toContain(429);
  });
});
