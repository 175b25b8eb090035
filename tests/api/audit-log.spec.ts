import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditPageSchema, ROLES, type Role } from '@batchproof/shared';
import { auditEvents } from '../../apps/api/src/db/schema';
import { buildWorkshop, type BuiltWorkshop } from '../support/workshop-builder';
import { startApiHarness, TEST_JWT_SECRET, type ApiHarness } from '../support/api-harness';
import { bearer } from '../support/auth-header';

let h: ApiHarness;
let w: BuiltWorkshop;
let other: BuiltWorkshop;

beforeAll(async () => {
  h = await startApiHarness();
  w = await buildWorkshop(h.handle.db, TEST_JWT_SECRET);
  other = await buildWorkshop(h.handle.db, TEST_JWT_SECRET, { roles: ['owner'] });
  const event = (
    at: string,
    actor: Role,
    action: string,
    subjectType: string,
    subjectId: string,
    detail: Record<string, unknown> | null = null,
  ) => ({
    workshopId: w.id,
    actorId: w.members[actor].id,
    action,
    subjectType,
    subjectId,
    detail,
    createdAt: new Date(at),
  });
  await h.handle.db.insert(auditEvents).values([
    event('2026-11-19T23:59:59Z', 'owner', 'formula.released', 'formula_version', 'v-1'),
    event('2026-11-20T00:00:00Z', 'production', 'complaint.created', 'complaint', 'c-1', {
      productName: 'Sea Glass Fizzer, "large"',
      serious: true,
    }),
    event(
      '2026-11-21T12:00:00Z',
      'formulator',
      'complaint.changed',
      'complaint',
      '=HYPERLINK("x")',
      {
        changed: ['serious'],
      },
    ),
    event('2026-11-23T08:00:00Z', 'owner', 'archive', 'material', 'm-1'),
  ]);
  await h.handle.db.insert(auditEvents).values({
    workshopId: other.id,
    actorId: other.members.owner.id,
    action: 'complaint.created',
    subjectType: 'complaint',
    subjectId: 'elsewhere',
  });
});
afterAll(() => h.close());

const list = async (query = '', who = w.members.owner) => {
  const res = await request(h.app).get(`/api/audit-events?${query}`).set(bearer(who));
  expect(res.status).toBe(200);
  return auditPageSchema.parse(res.body);
};
const ids = (page: { items: { subjectId: string | null }[] }) => page.items.map((e) => e.subjectId);

describe('/api/audit-events by role', () => {
  it.each([...ROLES, 'anonymous'] as const)('GET and the CSV export as %s', async (role) => {
    const headers = role === 'anonymous' ? {} : bearer(w.members[role]);
    const expected = role === 'anonymous' ? 401 : role === 'owner' ? 200 : 403;
    expect((await request(h.app).get('/api/audit-events').set(headers)).status).toBe(expected);
    expect((await request(h.app).get('/api/audit-events/export.csv').set(headers)).status).toBe(
      expected,
    );
  });

  it('answers another workshop’s owner with that workshop’s log only', async () => {
    expect(ids(await list('', other.members.owner))).toEqual(['elsewhere']);
    const csv = await request(h.app)
      .get('/api/audit-events/export.csv')
      .set(bearer(other.members.owner));
    expect(csv.text).not.toContain('c-1');
  });
});

describe('GET /api/audit-events', () => {
  it('lists newest first with who did it by name', async () => {
    const page = await list();
    expect(ids(page)).toEqual(['m-1', '=HYPERLINK("x")', 'c-1', 'v-1']);
    expect(page.total).toBe(4);
    expect(page.items[2]).toMatchObject({
      at: '2026-11-20T00:00:00.000Z',
      actorName: 'Test production',
      action: 'complaint.created',
      subjectType: 'complaint',
      detail: { productName: 'Sea Glass Fizzer, "large"', serious: true },
    });
  });

  it('filters by subject type, member, days (both included, UTC) and text', async () => {
    expect(ids(await list('subjectType=complaint'))).toEqual(['=HYPERLINK("x")', 'c-1']);
    expect(ids(await list(`actorId=${w.members.owner.id}`))).toEqual(['m-1', 'v-1']);
    // 20 Nov from its first second to 21 Nov's last: not 19 Nov 23:59:59 nor 23 Nov.
    expect(ids(await list('from=2026-11-20&to=2026-11-21'))).toEqual(['=HYPERLINK("x")', 'c-1']);
    expect(ids(await list('q=sea glass'))).toEqual(['c-1']);
    expect(ids(await list('q=archive'))).toEqual(['m-1']);
  });

  it('pages, and refuses a bad query with field errors', async () => {
    const second = await list('pageSize=3&page=2');
    expect([second.total, ids(second)]).toEqual([4, ['v-1']]);
    const res = await request(h.app)
      .get(
        '/api/audit-events?from=2026-11-21&to=2026-11-20&actorId=someone&subjectType=DROP%20TABLE',
      )
      .set(bearer(w.members.owner));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual([
      'actorId',
      'subjectType',
      'to',
    ]);
  });
});

describe('GET /api/audit-events/export.csv', () => {
  it('exports the filtered log, quoted, with formula-like cells made inert', async () => {
    const res = await request(h.app)
      .get('/api/audit-events/export.csv?subjectType=complaint')
      .set(bearer(w.members.owner));
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toBe('attachment; filename=audit-log.csv');
    expect(res.text.split('\r\n')).toEqual([
      'when,who,action,subjectType,subjectId,detail',
      // A cell a spreadsheet would run as a formula gets an apostrophe in front (OWASP CSV
      // injection advice); quotes inside a cell are doubled (RFC 4180). PostgreSQL's jsonb keeps
      // the detail's keys shorter first.
      `2026-11-21T12:00:00.000Z,Test formulator,complaint.changed,complaint,"'=HYPERLINK(""x"")","{""changed"":[""serious""]}"`,
      `2026-11-20T00:00:00.000Z,Test production,complaint.created,complaint,c-1,"{""serious"":true,""productName"":""Sea Glass Fizzer, \\""large\\""""}"`,
    ]);
  });
});
