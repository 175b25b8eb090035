import request from 'supertest';
import { and, eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import {
  assessmentListSchema,
  safetyNotesRecordSchema,
  shareListSchema,
  type AssessmentDetail,
} from '@batchproof/shared';
import { writeUnlessSigned } from '../../apps/api/src/assessments/assessments-domain';
import { updateAssessment } from '../../apps/api/src/assessments/assessments-repository';
import { assessments, auditEvents } from '../../apps/api/src/db/schema';
import { bearer } from '../support/auth-header';
import { aSignableUpdate, assessmentWorkspaceForFile } from '../support/assessment-workspace';

const ws = assessmentWorkspaceForFile();

const rowOf = async (id: string) => {
  const [row] = await ws.h.handle.db.select().from(assessments).where(eq(assessments.id, id));
  return row!;
};

const actionsOn = async (subjectId: string) =>
  (
    await ws.h.handle.db
      .select({ action: auditEvents.action, actorId: auditEvents.actorId })
      .from(auditEvents)
      .where(and(eq(auditEvents.workshopId, ws.w.id), eq(auditEvents.subjectId, subjectId)))
      .orderBy(auditEvents.createdAt)
  ).map((e) => [e.action, e.actorId]);

/** The substances of the packet with a point of departure for the first one. */
const withPod = (detail: AssessmentDetail, pod: number) => [
  {
    substanceKey: detail.packet.substances[0]!.key,
    pointOfDepartureMgPerKgDay: pod,
    pointOfDepartureSource: 'Repeated-dose oral study, NOAEL',
    dermalAbsorptionPercent: 10,
    dermalAbsorptionSource: 'In vitro skin study',
  },
];

describe('sharing, assessing and signing one formula version', () => {
  it('runs from the share to the signed, locked assessment and its PDF', async () => {
    const { h, w } = ws;
    const owner = w.members.owner;
    const assessor = w.members.assessor;
    const { versionId, name } = await ws.releasedVersion();

    // The owner shares; the assessor is mailed and sees it waiting.
    const share = await ws.shared(versionId);
    expect(share).toMatchObject({
      versionId,
      versionNumber: 1,
      formulaName: name,
      assessorId: assessor.id,
      sharedByName: owner.name,
      assessmentId: null,
    });
    const mail = await h.mail.waitFor(assessor.email);
    expect(mail.subject).toContain(name);
    expect(mail.text).toContain('/assessments');
    const again = await ws.share(versionId);
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(share.id);
    const list = assessmentListSchema.parse(
      (await request(h.app).get('/api/assessments').set(bearer(assessor))).body,
    );
    expect(list.waiting.map((s) => s.id)).toContain(share.id);

    // Accepting starts an empty draft.
    const started = await ws.accepted(share.id);
    expect(started).toMatchObject({
      status: 'draft',
      versionId,
      exposure: null,
      substances: [],
      partB: { conclusion: '', labelWarnings: '', reasoning: '', credentials: '' },
      canEdit: true,
    });
    expect(started.contentHash).toMatch(/^[0-9a-f]{64}$/);
    expect(started.packet.substances.length).toBeGreaterThan(0);
    const after = assessmentListSchema.parse(
      (await request(h.app).get('/api/assessments').set(bearer(assessor))).body,
    );
    expect(after.waiting.map((s) => s.id)).not.toContain(share.id);
    expect(after.items.map((a) => a.id)).toContain(started.id);
    const twice = await request(h.app)
      .post('/api/assessments')
      .set(bearer(assessor))
      .send({ shareId: share.id });
    expect(twice.status).toBe(409);

    // The assessor enters exposure and a point of departure; the margins follow.
    const put = await ws.put(started.id, aSignableUpdate({ substances: withPod(started, 500) }));
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    const detail = await ws.detail(started.id);
    const substance = started.packet.substances[0]!;
    const margin = detail.packet.margins.find((m) => m.substanceKey === substance.key)!;
    // SCCS Notes of Guidance (SCCS/1647/22), 3-3.5: A = amount × RF × 1000 / bw (mg/kg bw/day),
    // SED = A × C/100 × DAp/100, MoS = PoD_sys / SED.
    const a = (7.82 * 1 * 1000) / 60;
    const sed = (a * substance.percent * 10) / 10_000;
    expect(detail.packet.exposure?.exposureMgPerKgDay).toBeCloseTo(a, 2);
    expect(margin.sedMgPerKgDay).toBeCloseTo(sed, 4);
    expect(margin.marginOfSafety).toBeCloseTo(500 / sed, 2);
    expect(margin.flagged).toBe(margin.marginOfSafety! < 100);
    expect(detail.contentHash).not.toBe(started.contentHash);

    // The hash moves with a point of departure.
    const changed = await ws.put(
      started.id,
      aSignableUpdate({ substances: withPod(started, 800) }),
    );
    expect(changed.status).toBe(200);
    const moved = await ws.detail(started.id);
    expect(moved.contentHash).not.toBe(detail.contentHash);

    // Signing with a stale hash is refused; with the packet's hash it signs.
    const stale = await ws.sign(started.id, detail.contentHash);
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('packet_changed');
    expect((await rowOf(started.id)).status).toBe('draft');
    const signed = await ws.sign(started.id, moved.contentHash);
    expect(signed.status, JSON.stringify(signed.body)).toBe(200);
    expect(signed.body).toMatchObject({
      status: 'signed',
      contentHash: moved.contentHash,
      canEdit: false,
      packet: { assessment: { status: 'signed', signedByName: assessor.name } },
    });
    const row = await rowOf(started.id);
    expect(row).toMatchObject({
      status: 'signed',
      signedBy: assessor.id,
      signedByName: assessor.name,
      contentHash: moved.contentHash,
    });
    expect(row.signedAt).toBeInstanceOf(Date);
    expect(row.signedPacket?.assessment.contentHash).toBe(moved.contentHash);
    expect(row.signedPacket?.assessment.signedAt).toBe(row.signedAt!.toISOString());
    expect(await actionsOn(started.id)).toEqual([
      ['assessment.started', assessor.id],
      ['assessment.changed', assessor.id],
      ['assessment.changed', assessor.id],
      ['assessment.signed', assessor.id],
    ]);

    // Locked: another PUT or sign is refused and the row stays as signed.
    const late = await ws.put(started.id, aSignableUpdate({ substances: [] }));
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('assessment_signed');
    const resign = await ws.sign(started.id, moved.contentHash);
    expect(resign.body.error.code).toBe('assessment_signed');
    expect(await rowOf(started.id)).toEqual(row);
    // The database refuses a direct change of the signed row too.
    await expect(
      h.handle.db.execute(
        sql`update assessments set part_b = '{}'::jsonb where id = ${started.id}`,
      ),
    ).rejects.toThrow();
    await expect(
      h.handle.db.execute(sql`delete from assessments where id = ${started.id}`),
    ).rejects.toThrow();
    expect(await rowOf(started.id)).toEqual(row);

    // The owner reads it as signed: the stored hash and packet, and the PDF.
    const ownerView = await ws.detail(started.id, owner);
    expect(ownerView.contentHash).toBe(moved.contentHash);
    expect(ownerView.packet).toEqual(row.signedPacket);
    const pdf = await request(h.app)
      .get(`/api/assessments/${started.id}/packet.pdf`)
      .set(bearer(owner))
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect((pdf.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
  });

  it('keeps the safety notes of a version in the packet, and locks them once signed', async () => {
    const { h, w } = ws;
    const { formulaId, assessment } = await ws.startedAssessment();
    const url = `/api/formulas/${formulaId}/versions/1/safety-notes`;
    const empty = await request(h.app).get(url).set(bearer(w.members.assessor));
    expect(empty.status).toBe(200);
    expect(safetyNotesRecordSchema.parse(empty.body)).toMatchObject({
      updatedAt: null,
      notes: { stability: '' },
    });
    const notes = { stability: '12 weeks at 40 °C: no change in colour, odour or pH' };
    const put = await request(h.app).put(url).set(bearer(w.members.formulator)).send(notes);
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect(put.body).toMatchObject({ notes, updatedByName: w.members.formulator.name });
    const detail = await ws.detail(assessment.id);
    expect(detail.packet.notes.stability).toBe(notes.stability);
    expect(detail.contentHash).not.toBe(assessment.contentHash);

    expect((await ws.put(assessment.id, aSignableUpdate())).status).toBe(200);
    const ready = await ws.detail(assessment.id);
    expect((await ws.sign(assessment.id, ready.contentHash)).status).toBe(200);
    const late = await request(h.app)
      .put(url)
      .set(bearer(w.members.owner))
      .send({ stability: 'changed' });
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('assessment_signed');
  });

  it('a draft PDF is the live packet', async () => {
    const { assessment } = await ws.startedAssessment();
    const res = await request(ws.h.app)
      .get(`/api/assessments/${assessment.id}/packet.pdf`)
      .set(bearer(ws.w.members.assessor));
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toContain('DRAFT');
  });

  it('unsharing hides the version again; the owner still sees the draft', async () => {
    const { h, w } = ws;
    const { share, assessment } = await ws.startedAssessment();
    const del = await request(h.app)
      .delete(`/api/assessment-shares/${share.id}`)
      .set(bearer(w.members.owner));
    expect(del.status).toBe(204);
    const mine = await request(h.app)
      .get(`/api/assessments/${assessment.id}`)
      .set(bearer(w.members.assessor));
    expect(mine.status).toBe(404);
    const shares = shareListSchema.parse(
      (await request(h.app).get('/api/assessment-shares').set(bearer(w.members.assessor))).body,
    );
    expect(shares.items.map((s) => s.id)).not.toContain(share.id);
    expect((await ws.detail(assessment.id, w.members.owner)).status).toBe('draft');
    const twice = await request(h.app)
      .delete(`/api/assessment-shares/${share.id}`)
      .set(bearer(w.members.owner));
    expect(twice.status).toBe(404);
    expect(await actionsOn(share.id)).toEqual([
      ['assessment.shared', w.members.owner.id],
      ['assessment.unshared', w.members.owner.id],
    ]);
  });
});

describe('what is refused, with field errors', () => {
  it('refuses a draft version, a member who is not an assessor and malformed ids', async () => {
    const { h, w } = ws;
    const { formulaId, versionId } = await ws.releasedVersion();
    const next = await request(h.app)
      .post(`/api/formulas/${formulaId}/versions`)
      .set(bearer(w.members.formulator))
      .send({});
    expect(next.status).toBe(201);
    const draft = await ws.share(next.body.id as string);
    expect(draft.status).toBe(400);
    expect(draft.body.error.fieldErrors).toHaveProperty('versionId');
    const notAssessor = await ws.share(versionId, w.members.viewer.id);
    expect(notAssessor.status).toBe(400);
    expect(notAssessor.body.error.fieldErrors).toHaveProperty('assessorId');
    const otherWorkshop = await ws.share(versionId, ws.other.members.owner.id);
    expect(otherWorkshop.body.error.fieldErrors).toHaveProperty('assessorId');
    const malformed = await ws.share('nope', 'nope');
    expect(malformed.status).toBe(400);
    expect(Object.keys(malformed.body.error.fieldErrors).sort()).toEqual([
      'assessorId',
      'versionId',
    ]);
    const query = await request(h.app)
      .get('/api/assessment-shares?versionId=nope')
      .set(bearer(w.members.owner));
    expect(query.status).toBe(400);
    expect(query.body.error.fieldErrors).toHaveProperty('versionId');
  });

  it('answers bad bodies with 400 and field paths, never 500', async () => {
    const { assessment } = await ws.startedAssessment();
    const bodies: [unknown, string][] = [
      [{}, 'exposure'],
      [{ ...aSignableUpdate(), substances: 'all' }, 'substances'],
      [
        {
          ...aSignableUpdate(),
          exposure: { ...aSignableUpdate().exposure, retentionFactor: 2 },
        },
        'exposure.retentionFactor',
      ],
      [
        { ...aSignableUpdate(), exposure: { ...aSignableUpdate().exposure, source: '' } },
        'exposure.source',
      ],
      [
        {
          ...aSignableUpdate(),
          substances: [
            {
              substanceKey: 'no such substance',
              pointOfDepartureMgPerKgDay: 10,
              pointOfDepartureSource: '',
              dermalAbsorptionPercent: null,
              dermalAbsorptionSource: '',
            },
          ],
        },
        'substances.0.substanceKey',
      ],
      [
        {
          ...aSignableUpdate(),
          substances: [
            {
              substanceKey: assessment.packet.substances[0]!.key,
              pointOfDepartureMgPerKgDay: -1,
              pointOfDepartureSource: '',
              dermalAbsorptionPercent: 101,
              dermalAbsorptionSource: '',
            },
          ],
        },
        'substances.0.pointOfDepartureMgPerKgDay',
      ],
      [{ ...aSignableUpdate(), partB: { conclusion: 7 } }, 'partB.conclusion'],
    ];
    for (const [body, field] of bodies) {
      const res = await ws.put(assessment.id, body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.fieldErrors, JSON.stringify(res.body)).toHaveProperty([field]);
    }
    const sign = await request(ws.h.app)
      .post(`/api/assessments/${assessment.id}/sign`)
      .set(bearer(ws.w.members.assessor))
      .send({ contentHash: 'abc' });
    expect(sign.status).toBe(400);
    expect(Object.keys(sign.body.error.fieldErrors).sort()).toEqual(['confirm', 'contentHash']);
    expect((await rowOf(assessment.id)).exposure).toBeNull();
  });

  it('will not sign without exposure, conclusion and credentials', async () => {
    const { assessment } = await ws.startedAssessment();
    const res = await ws.sign(assessment.id, assessment.contentHash);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual([
      'exposure',
      'partB.conclusion',
      'partB.credentials',
    ]);
    const partial = aSignableUpdate();
    const put = await ws.put(assessment.id, {
      ...partial,
      partB: { ...partial.partB, credentials: '   ' },
    });
    expect(put.status).toBe(200);
    const detail = await ws.detail(assessment.id);
    const again = await ws.sign(assessment.id, detail.contentHash);
    expect(again.status).toBe(400);
    expect(Object.keys(again.body.error.fieldErrors)).toEqual(['partB.credentials']);
    expect((await rowOf(assessment.id)).status).toBe('draft');
  });

  it('signs once when two signatures race; the other is told it is signed', async () => {
    const { assessment } = await ws.startedAssessment();
    expect((await ws.put(assessment.id, aSignableUpdate())).status).toBe(200);
    const { contentHash } = await ws.detail(assessment.id);
    const answers = await Promise.all([
      ws.sign(assessment.id, contentHash),
      ws.sign(assessment.id, contentHash),
    ]);
    expect(answers.map((r) => r.status).sort()).toEqual([200, 409]);
    expect(answers.find((r) => r.status === 409)!.body.error.code).toBe('assessment_signed');
  });

  it("maps the database trigger's refusal to 409 assessment_signed", async () => {
    const { assessment } = await ws.startedAssessment();
    expect((await ws.put(assessment.id, aSignableUpdate())).status).toBe(200);
    const { contentHash } = await ws.detail(assessment.id);
    expect((await ws.sign(assessment.id, contentHash)).status).toBe(200);
    // Past the route's own check, straight at the row: the trigger refuses, the API says why.
    await expect(
      writeUnlessSigned(() =>
        updateAssessment(ws.h.handle.db, ws.w.id, assessment.id, {
          partB: {
            conclusion: 'Changed after signing',
            labelWarnings: '',
            reasoning: '',
            credentials: '',
          },
        }),
      ),
    ).rejects.toMatchObject({ status: 409, code: 'assessment_signed' });
    expect((await rowOf(assessment.id)).partB.conclusion).not.toBe('Changed after signing');
  });

  it('a retried start with the same Idempotency-Key answers the first assessment', async () => {
    const v = await ws.releasedVersion();
    const share = await ws.shared(v.versionId);
    const send = () =>
      request(ws.h.app)
        .post('/api/assessments')
        .set(bearer(ws.w.members.assessor))
        .set('Idempotency-Key', `start-${share.id}`)
        .send({ shareId: share.id });
    const first = await send();
    const retry = await send();
    expect([first.status, retry.status]).toEqual([201, 201]);
    expect(retry.headers['idempotent-replayed']).toBe('true');
    expect(retry.body.id).toBe(first.body.id);
  });
});
