import { describe, expect, it } from 'vitest';
import { fieldErrorsFromZod } from '../errors/error-envelope';
import {
  complaintCreateSchema,
  complaintListQuerySchema,
  SERIOUS_ADVERSE_EVENT_HELP,
} from './complaint-schema';

const FORMULA_ID = '3f0c6f7e-2b1a-4c3d-9e8f-1a2b3c4d5e6f';

const aComplaint = (overrides: Record<string, unknown> = {}) => ({
  formulaId: FORMULA_ID,
  receivedOn: '2026-11-20',
  whatHappened: 'Red, itchy patches on both forearms the morning after a bath with the fizzer.',
  serious: false,
  ...overrides,
});

const refusals = (body: unknown) => {
  const result = complaintCreateSchema.safeParse(body);
  return result.success ? {} : fieldErrorsFromZod(result.error);
};

describe('complaintCreateSchema', () => {
  it('takes a complaint with only a product, a day, what happened and whether it is serious', () => {
    expect(complaintCreateSchema.parse(aComplaint())).toEqual({
      formulaId: FORMULA_ID,
      batchId: null,
      finishedLotCode: null,
      receivedOn: '2026-11-20',
      reporterName: null,
      reporterContact: null,
      whatHappened: 'Red, itchy patches on both forearms the morning after a bath with the fizzer.',
      bodyArea: null,
      serious: false,
      status: 'open',
      followUpNotes: null,
      reportedToFdaOn: null,
    });
  });

  it('asks for what happened and for a yes or no on serious, in plain words', () => {
    expect(refusals(aComplaint({ whatHappened: '   ', serious: undefined }))).toEqual({
      whatHappened: ['What happened is required'],
      serious: ['Say whether it is a serious adverse event'],
    });
  });

  it('refuses a received day in the future or before the holiday list starts', () => {
    expect(refusals(aComplaint({ receivedOn: '2999-01-04' }))).toEqual({
      receivedOn: ['The received date cannot be in the future'],
    });
    expect(refusals(aComplaint({ receivedOn: '1985-12-31' }))).toEqual({
      receivedOn: ['Enter a day in 1986 or later'],
    });
    expect(refusals(aComplaint({ receivedOn: '20/11/2026' }))).toEqual({
      receivedOn: ['Enter the day it was received as YYYY-MM-DD'],
    });
  });

  it('refuses a report to FDA dated before the complaint arrived', () => {
    expect(refusals(aComplaint({ serious: true, reportedToFdaOn: '2026-11-19' }))).toEqual({
      reportedToFdaOn: ['It cannot have been reported before it was received'],
    });
  });

  it('reads a lot code with the spaces a customer puts in, and refuses one we never print', () => {
    expect(
      complaintCreateSchema.parse(aComplaint({ finishedLotCode: ' 261120 FZ 01 ' })),
    ).toMatchObject({ finishedLotCode: '261120FZ01' });
    // "é" is outside the GS1 character set 82 a (10) lot is printed in.
    expect(refusals(aComplaint({ finishedLotCode: 'LOTé1' }))).toEqual({
      finishedLotCode: [
        'A lot code on our labels uses only letters, digits and ! " % & \' ( ) * + , - . / : ; < = > ? _',
      ],
    });
  });

  it('names the MoCRA outcomes in the help and leaves the decision with the owner', () => {
    // FD&C Act §604(5), 21 U.S.C. 364(5).
    for (const outcome of [
      'death',
      'inpatient hospital care',
      'an infection',
      'second- or third-degree burns',
      'significant hair loss',
      'medical or surgical intervention',
    ]) {
      expect(SERIOUS_ADVERSE_EVENT_HELP).toContain(outcome);
    }
    expect(SERIOUS_ADVERSE_EVENT_HELP).toContain('You and your adviser decide');
  });
});

describe('complaintListQuerySchema', () => {
  it('reads the serious filter from query-string text', () => {
    expect(complaintListQuerySchema.parse({ serious: 'true', status: 'open' })).toMatchObject({
      serious: true,
      status: 'open',
      sort: 'receivedOn',
    });
    expect(complaintListQuerySchema.safeParse({ serious: 'yes' }).success).toBe(false);
  });
});
