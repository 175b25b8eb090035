import { SubmissionKey } from './submission-key';

describe('SubmissionKey', () => {
  it('keeps the key while the same content is submitted again, as a retry', () => {
    const submission = new SubmissionKey();
    const first = submission.for({ quantity: 5, unit: 'kg' });
    expect(first).toMatch(/^[0-9a-f-]{36}$/);
    expect(submission.for({ quantity: 5, unit: 'kg' })).toBe(first);
  });

  it('makes a new key when the content changes, and after the submission succeeded', () => {
    const submission = new SubmissionKey();
    const first = submission.for({ quantity: 5 });
    const changed = submission.for({ quantity: 6 });
    expect(changed).not.toBe(first);
    submission.done();
    expect(submission.for({ quantity: 6 })).not.toBe(changed);
  });

  it('tells files apart by name, size and modification time', () => {
    const submission = new SubmissionKey();
    const sds = new File(['%PDF-1.4'], 'sds.pdf', { lastModified: 1 });
    const first = submission.for({ title: 'SDS', file: sds });
    expect(submission.for({ title: 'SDS', file: sds })).toBe(first);
    const other = new File(['%PDF-1.4 longer'], 'sds.pdf', { lastModified: 1 });
    expect(submission.for({ title: 'SDS', file: other })).not.toBe(first);
  });
});
