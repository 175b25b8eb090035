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

  it("puts a US listing's permitted uses and an EU field of application in words", () => {
    // 21 CFR 73.2725: ultramarines, externally applied cosmetics (including the eye area)
    const us = referenceDetails({
      uses: { generally: false, eyeArea: true, externallyApplied: true },
    });
    expect(us).toEqual([{ label: 'Permitted', value: 'externally applied only; eye area' }]);
    const eu = referenceDetails({ field: 'rinse-off-only', maxPercent: 0.5 });
    expect(eu).toEqual([
      { label: 'Field of application', value: 'rinse-off products only' },
      { label: 'Maximum %', value: '0.5' },
    ]);
  });
});
