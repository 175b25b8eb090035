import { assessmentPath } from './assessment-form';

describe('assessmentPath', () => {
  it("puts a missing exposure on the picker and an unknown substance's message above the form", () => {
    expect(assessmentPath('exposure')).toBe('exposure.choice');
    expect(assessmentPath('exposure.presetKey')).toBe('exposure.choice');
    expect(assessmentPath('exposure.dailyAmountGrams')).toBe('exposure.dailyAmountGrams');
    expect(assessmentPath('substances.3.pointOfDepartureMgPerKgDay')).toBe(
      'substances.3.pointOfDepartureMgPerKgDay',
    );
    expect(assessmentPath('substances.3.substanceKey')).toBe('no field');
  });
});
