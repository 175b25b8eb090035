import { startingProfile } from './product-types';

describe('startingProfile', () => {
  it('marks a bath product as used in the bath without ticking mucous-membrane contact', () => {
    // The engine reads bath use as mucous-membrane contact and labels those findings as its
    // interpretation; a pre-ticked box would turn the interpretation into the maker's statement.
    const profile = startingProfile('fizzer', ['US', 'EU']);
    expect(profile.inBath).toBe(true);
    expect(profile.contact?.mucousMembranes).toBe(false);
  });

  it('marks a lip balm as touching the lips', () => {
    expect(startingProfile('lip-balm', ['US']).contact?.lips).toBe(true);
  });
});
