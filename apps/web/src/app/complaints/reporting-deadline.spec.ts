import { formatDueDay, reportingDeadline } from './reporting-deadline';

// A serious event received Fri 20 Nov 2026 is due Mon 14 Dec 2026: 15 US business days, with
// Thanksgiving (Thu 26 Nov, 5 U.S.C. 6103) skipped (FD&C Act §605(b)(1)).
const clock = { dueOn: '2026-12-14', reportedOn: null };

describe('reportingDeadline', () => {
  it('names the due day with its weekday and the business days left', () => {
    expect(formatDueDay('2026-12-14', 'en-GB')).toBe('Mon 14 Dec 2026');
    expect(reportingDeadline({ ...clock, businessDaysLeft: 8, state: 'running' }, 'en-GB')).toBe(
      'Report to FDA by Mon 14 Dec 2026 — 8 business days left.',
    );
    expect(reportingDeadline({ ...clock, businessDaysLeft: 1, state: 'running' }, 'en-GB')).toBe(
      'Report to FDA by Mon 14 Dec 2026 — 1 business day left.',
    );
  });

  it('says plainly when today is the last day and when it is overdue', () => {
    expect(reportingDeadline({ ...clock, businessDaysLeft: 0, state: 'running' }, 'en-GB')).toBe(
      'Report to FDA by Mon 14 Dec 2026 — today is the last day.',
    );
    expect(reportingDeadline({ ...clock, businessDaysLeft: -2, state: 'overdue' }, 'en-GB')).toBe(
      'Overdue: the report to FDA was due by Mon 14 Dec 2026, 2 business days ago.',
    );
  });

  it('says when it was reported, and whether in time', () => {
    expect(
      reportingDeadline(
        {
          dueOn: '2026-12-14',
          reportedOn: '2026-12-11',
          businessDaysLeft: null,
          state: 'reported',
        },
        'en-GB',
      ),
    ).toBe('Reported to FDA on Fri 11 Dec 2026, within the deadline (Mon 14 Dec 2026).');
    expect(
      reportingDeadline(
        {
          dueOn: '2026-12-14',
          reportedOn: '2026-12-15',
          businessDaysLeft: null,
          state: 'reported-late',
        },
        'en-GB',
      ),
    ).toBe('Reported to FDA on Tue 15 Dec 2026, after the deadline of Mon 14 Dec 2026.');
  });
});
