import { describe, expect, it } from 'vitest';
import { addYears } from '../dates/calendar-day';
import {
  newMedicalInformationClock,
  retainUntil,
  seriousAdverseEventClock,
} from './adverse-event-clock';

describe('seriousAdverseEventClock', () => {
  // FD&C Act §605(b)(1): no later than 15 business days after the report is received. Received
  // Friday 20 November 2026 → due Monday 14 December 2026 (worked out day by day in
  // business-days.spec.ts, Thanksgiving 26 November skipped).
  const receivedOn = '2026-11-20';

  it('runs with the business days left until the due day', () => {
    expect(seriousAdverseEventClock({ receivedOn, today: '2026-12-02' })).toEqual({
      dueOn: '2026-12-14',
      businessDaysLeft: 8,
      overdue: false,
      state: 'running',
      reportedOn: null,
      source: 'FD&C Act §605(b)(1), 21 U.S.C. 364a(b)(1)',
    });
  });

  it('is still on time on the due day and overdue the day after', () => {
    const onDueDay = seriousAdverseEventClock({ receivedOn, today: '2026-12-14' });
    expect([onDueDay.businessDaysLeft, onDueDay.overdue, onDueDay.state]).toEqual([
      0,
      false,
      'running',
    ]);
    const dayAfter = seriousAdverseEventClock({ receivedOn, today: '2026-12-15' });
    expect([dayAfter.businessDaysLeft, dayAfter.overdue, dayAfter.state]).toEqual([
      -1,
      true,
      'overdue',
    ]);
  });

  it('stops once reported, and says whether the report was late', () => {
    const onTime = seriousAdverseEventClock({
      receivedOn,
      today: '2027-01-20',
      reportedOn: '2026-12-14',
    });
    expect([onTime.state, onTime.overdue, onTime.businessDaysLeft]).toEqual([
      'reported',
      false,
      null,
    ]);
    const late = seriousAdverseEventClock({
      receivedOn,
      today: '2027-01-20',
      reportedOn: '2026-12-15',
    });
    expect(late.state).toBe('reported-late');
  });
});

describe('newMedicalInformationClock', () => {
  // FD&C Act §605(b)(2): new medical information received within 1 year of the initial report,
  // no later than 15 business days after it is received.
  it('gives 15 business days for information within a year of the report', () => {
    // Hand-worked from Fri 10 Dec 2027: Mon 13 (1) … Thu 23 (9), Fri 24 Christmas observed,
    // Mon 27 (10) … Thu 30 (13), Fri 31 New Year's Day 2028 observed, Mon 3 Jan (14), Tue 4 (15).
    const clock = newMedicalInformationClock({
      initialReportOn: '2026-12-10',
      receivedOn: '2027-12-10',
      today: '2027-12-10',
    });
    expect(clock?.dueOn).toBe('2028-01-04');
    expect(clock?.source).toBe('FD&C Act §605(b)(2), 21 U.S.C. 364a(b)(2)');
  });

  it('has no clock for information arriving more than a year after the report', () => {
    expect(
      newMedicalInformationClock({
        initialReportOn: '2026-12-10',
        receivedOn: '2027-12-11',
        today: '2027-12-11',
      }),
    ).toBeNull();
  });
});

describe('retainUntil', () => {
  // FD&C Act §605(e)(1): 6 years; 3 years for a small business.
  it('keeps records 6 years, 3 for a small business', () => {
    expect(retainUntil({ recordedOn: '2026-12-02', smallBusiness: false })).toEqual({
      keepUntil: '2032-12-02',
      years: 6,
      source: 'FD&C Act §605(e)(1), 21 U.S.C. 364a(e)(1)',
    });
    expect(retainUntil({ recordedOn: '2026-12-02', smallBusiness: true }).keepUntil).toBe(
      '2029-12-02',
    );
  });

  it('ends a period that starts on 29 February on 1 March, never early', () => {
    expect(addYears('2028-02-29', 3)).toBe('2031-03-01');
    expect(addYears('2028-02-29', 4)).toBe('2032-02-29');
  });
});
