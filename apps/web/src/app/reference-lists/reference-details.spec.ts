import { referenceDetails } from './reference-details';

describe('referenceDetails', () => {
  it('shows CI numbers, CFR section and certification in a fixed order, skipping empty values', () => {
    const details = referenceDetails({
      cfrSection: '21 CFR 73.2725',
      colourIndex: ['77007'],
      certificationRequired: false,
      cas: null,
      note: 'ignored',
    });
    expect(details).toEqual([
      { label: 'CI', value: '77007' },
      { label: 'CFR', value: '21 CFR 73.2725' },
      { label: 'Certified batches', value: 'no' },
    ]);
  });
});
