import type { ReadinessItem } from '@batchproof/shared';
import { canadaClock, recordKindOfItem } from './readiness-words';

const item = (key: string, link: string | null): ReadinessItem => ({
  key,
  label: key,
  done: false,
  detail: null,
  link,
  source: 'x',
});

describe('canadaClock', () => {
  // Cosmetic Regulations (C.R.C., c. 869), s. 30(1): "at the latest 10 days after the manufacturer
  // or importer first sells a cosmetic".
  it('is due 10 days after the first sale, across a month end', () => {
    expect(canadaClock('2026-12-25', '2026-12-26')).toEqual({
      dueOn: '2027-01-04',
      daysLeft: 9,
      overdue: false,
    });
  });

  it('is due, not overdue, on the tenth day, and overdue the day after', () => {
    expect(canadaClock('2026-12-01', '2026-12-11')).toMatchObject({ daysLeft: 0, overdue: false });
    expect(canadaClock('2026-12-01', '2026-12-13')).toMatchObject({ daysLeft: -2, overdue: true });
  });
});

describe('recordKindOfItem', () => {
  it('opens the record its key names when the item is done on the readiness page', () => {
    // The keys marketReadiness gives.
    expect(recordKindOfItem(item('listing', '/readiness'), 'US')).toBe('us-listing');
    expect(recordKindOfItem(item('substantiation', '/readiness'), 'US')).toBe('us-substantiation');
    expect(recordKindOfItem(item('notification', '/readiness'), 'CA')).toBe('ca-notification');
    expect(recordKindOfItem(item('notification', '/readiness'), 'UK')).toBe('uk-notification');
    expect(recordKindOfItem(item('us-listing', '/readiness'), 'US')).toBe('us-listing');
  });

  it('leaves items done elsewhere to their links', () => {
    expect(recordKindOfItem(item('notification', '/labels'), 'EU')).toBeNull();
    expect(recordKindOfItem(item('substantiation', '/assessments/a1'), 'US')).toBeNull();
    expect(recordKindOfItem(item('safety', '/readiness'), 'US')).toBeNull();
  });
});
