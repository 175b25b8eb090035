import { TestBed } from '@angular/core/testing';
import { ROLE_DESCRIPTIONS, type Attention, type Role } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import HomePage from './home-page';

const FORMULA_ID = '5f1c2d3e-0000-4000-8000-000000000001';
const LOT_ID = '5f1c2d3e-0000-4000-8000-000000000002';
const MATERIAL_ID = '5f1c2d3e-0000-4000-8000-000000000003';

/** A workshop well under way: materials, lots, five formulas, two members, nothing pending. */
function anAttention(overrides: Partial<Attention> = {}): Attention {
  return {
    asOf: '2026-04-01',
    items: [],
    counts: { 'formula-blocked': 0, 'lot-expiring': 0, 'material-documents': 0 },
    progress: { materials: 12, lots: 7, formulas: 5, members: 2 },
    ...overrides,
  };
}

async function openHomeAs(role: Role, attention: Attention = anAttention()) {
  const backend = await signedInAs(role);
  const fixture = TestBed.createComponent(HomePage);
  TestBed.tick();
  backend.expectOne('/api/attention').flush(attention);
  await fixture.whenStable();
  return fixture.nativeElement as HTMLElement;
}

const stepLinks = (el: HTMLElement) =>
  Array.from(el.querySelectorAll('.next a')).map((a) => a.getAttribute('href'));
const rows = (el: HTMLElement) =>
  Array.from(el.querySelectorAll('bp-attention-list li')).map((li) => ({
    icon: li.querySelector('mat-icon')?.textContent?.trim(),
    text: li.querySelector('a')?.textContent?.trim(),
    href: li.querySelector('a')?.getAttribute('href'),
  }));

describe('HomePage', () => {
  beforeEach(() => localStorage.clear());

  it('shows the workshop, the signed-in role and what that role can do today', async () => {
    const el = await openHomeAs('production');

    expect(el.querySelector('h1')?.textContent).toContain('Hollowmere Bathworks');
    expect(el.querySelector('[data-testid=signed-in-role]')?.textContent?.trim()).toBe(
      'production',
    );
    expect(el.textContent).toContain(ROLE_DESCRIPTIONS.production);
    // Production's description names its batch work; safety assessments are not open to it.
    expect(el.textContent).toMatch(/starts and records batches/);
    expect(el.textContent).not.toMatch(/assessment/i);
  });

  it('does not offer "Write your first formula" once the workshop has five formulas', async () => {
    const el = await openHomeAs('formulator');
    expect(el.textContent).not.toContain('Write your first formula');
    expect(stepLinks(el)).toEqual(['/reference']);
  });

  it('offers each first step a writer has not done yet, and only those', async () => {
    const progress = { materials: 3, lots: 0, formulas: 0, members: 2 };
    const el = await openHomeAs('formulator', anAttention({ progress }));
    expect(el.textContent).toContain('Write your first formula');
    expect(stepLinks(el)).toEqual(['/lots', '/formulas', '/reference']);
  });

  it('suggests inviting people to an owner working alone with no invitation out', async () => {
    const alone = anAttention({ progress: { materials: 1, lots: 1, formulas: 1, members: 1 } });
    expect((await openHomeAs('owner', alone)).textContent).toContain(
      'Invite the people you work with',
    );
    TestBed.resetTestingModule();
    expect((await openHomeAs('owner')).textContent).not.toContain(
      'Invite the people you work with',
    );
    TestBed.resetTestingModule();
    expect((await openHomeAs('viewer', alone)).textContent).not.toContain(
      'Invite the people you work with',
    );
  });

  it('offers production the goods-in step while no lot is recorded', async () => {
    const progress = { materials: 3, lots: 0, formulas: 2, members: 3 };
    const el = await openHomeAs('production', anAttention({ progress }));
    expect(stepLinks(el)).toEqual(['/lots', '/formulas', '/reference']);
  });

  it('shows a released version with blocking findings as a sentence with an icon and a link', async () => {
    const el = await openHomeAs(
      'viewer',
      anAttention({
        items: [
          {
            kind: 'formula-blocked',
            formulaId: FORMULA_ID,
            formulaName: 'Lavender Fizz',
            versionNumber: 3,
            state: 'released',
            blockCount: 2,
          },
        ],
        counts: { 'formula-blocked': 1, 'lot-expiring': 0, 'material-documents': 0 },
      }),
    );
    expect(el.textContent).toContain('1 formula version has blocking findings');
    expect(rows(el)).toEqual([
      {
        icon: 'block',
        text: 'Lavender Fizz: version 3 is released with 2 blocking findings.',
        href: `/formulas/${FORMULA_ID}/versions/3`,
      },
    ]);
  });

  it('words expiring lots and documents that are not current, and says when more are not listed', async () => {
    const el = await openHomeAs(
      'formulator',
      anAttention({
        items: [
          {
            kind: 'lot-expiring',
            lotId: LOT_ID,
            materialName: 'Shea butter',
            supplierLotNumber: 'SB-1',
            expiresOn: '2026-05-01',
            daysLeft: 30,
            stockOnHand: 2.5,
            unit: 'kg',
          },
          {
            kind: 'material-documents',
            materialId: MATERIAL_ID,
            materialName: 'Sea salt',
            documents: [
              {
                kind: 'sds',
                state: 'future-dated',
                message:
                  'The newest safety data sheet is dated 2027-01-01, after today: check its issue date',
              },
            ],
          },
        ],
        counts: { 'formula-blocked': 0, 'lot-expiring': 1, 'material-documents': 14 },
      }),
    );
    expect(rows(el)).toEqual([
      {
        icon: 'schedule',
        text: 'Lot SB-1 of Shea butter expires in 30 days, on May 1, 2026; 2.5 kg still in stock.',
        href: `/lots/${LOT_ID}`,
      },
      {
        icon: 'description',
        text: 'Sea salt: the newest safety data sheet is dated 2027-01-01, after today: check its issue date.',
        href: `/materials/${MATERIAL_ID}`,
      },
    ]);
    expect(el.textContent).toContain('14 materials are missing');
    expect(el.textContent).toContain('13 more not listed here.');
  });

  it('says plainly that nothing needs attention, and what was checked', async () => {
    const el = await openHomeAs('viewer');
    expect(el.querySelector('[data-testid=attention-empty]')?.textContent).toContain(
      'Nothing needs attention today: no draft or released version has blocking findings',
    );
    // The role's description says what the viewer reads: production and recall records
    // (batches, deliveries, traces, recalls, complaints) and now safety assessments and market
    // readiness too (issue 12), and that it changes nothing.
    expect(el.textContent).toContain(ROLE_DESCRIPTIONS.viewer);
    expect(ROLE_DESCRIPTIONS.viewer).toMatch(/batches/);
    expect(ROLE_DESCRIPTIONS.viewer).toMatch(/safety assessments, market readiness/);
    expect(ROLE_DESCRIPTIONS.viewer).toMatch(/changes nothing/);
  });

  it('tells an assessor that nothing tracked here is open to the role', async () => {
    const el = await openHomeAs('assessor', anAttention({ counts: {}, progress: null }));
    expect(el.querySelector('[data-testid=attention-empty]')?.textContent).toContain(
      'open to your role',
    );
    expect(stepLinks(el)).toEqual(['/reference']);
    // What the assessor does (issue 12): the shared versions and their own signed assessments,
    // and nothing of the maker's own records.
    expect(el.textContent).toContain(ROLE_DESCRIPTIONS.assessor);
    expect(ROLE_DESCRIPTIONS.assessor).toMatch(/formula versions shared with them/);
    expect(ROLE_DESCRIPTIONS.assessor).toMatch(/writes and signs their safety assessments/);
    expect(ROLE_DESCRIPTIONS.assessor).not.toMatch(/labels|materials|lots/i);
  });

  it("names what the owner alone does in issue 12's work: sharing versions with assessors", async () => {
    const el = await openHomeAs('owner');
    expect(el.textContent).toContain(ROLE_DESCRIPTIONS.owner);
    expect(ROLE_DESCRIPTIONS.owner).toMatch(/sharing formula versions with safety assessors/);
    // Writers record the maker's part: safety notes and notification references.
    expect(ROLE_DESCRIPTIONS.formulator).toMatch(/safety notes .* notification references/);
  });
});
