import type { HttpTestingController } from '@angular/common/http/testing';
import type { HttpRequest } from '@angular/common/http';
import { RouterTestingHarness } from '@angular/router/testing';
import type { Complaint } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import ComplaintPage from './complaint-page';

const ID = 'c0ffee00-0000-4000-8000-000000000001';
const FORMULA = 'f0000000-0000-4000-8000-000000000001';

/** Received Fri 20 Nov 2026, serious, sold in the US; today Wed 2 Dec 2026. */
const COMPLAINT: Complaint = {
  id: ID,
  createdAt: '2026-11-20T10:00:00.000Z',
  updatedAt: '2026-11-20T10:00:00.000Z',
  formulaId: FORMULA,
  productName: 'Sea Glass Fizzer',
  batchId: null,
  batchCode: null,
  finishedLotCode: '261101-SGF-1',
  receivedOn: '2026-11-20',
  reporterName: 'Ada Tillbrook',
  reporterContact: null,
  whatHappened: 'Blistered skin on both forearms.',
  bodyArea: 'Arms',
  serious: true,
  status: 'open',
  followUpNotes: null,
  reportedToFdaOn: null,
  // FD&C Act §605(b)(1): 15 business days, Thanksgiving (26 Nov, 5 U.S.C. 6103) skipped.
  usReportingClock: {
    dueOn: '2026-12-14',
    businessDaysLeft: 8,
    overdue: false,
    state: 'running',
    reportedOn: null,
    source: 'FD&C Act §605(b)(1), 21 U.S.C. 364a(b)(1)',
  },
  retention: {
    keepUntil: '2032-11-20',
    years: 6,
    source: 'FD&C Act §605(e)(1), 21 U.S.C. 364a(e)(1)',
  },
};

const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

async function open(complaint: Complaint) {
  const backend = await signedInAs('production', [
    { path: 'complaints', children: [] },
    { path: 'complaints/:id', component: ComplaintPage },
  ]);
  const harness = await RouterTestingHarness.create();
  await harness.navigateByUrl(`/complaints/${ID}`);
  (await sent(backend, (r) => r.url === '/api/formulas')).flush({
    items: [],
    total: 0,
    page: 1,
    pageSize: 100,
  });
  (await sent(backend, (r) => r.url === `/api/complaints/${ID}`)).flush(complaint);
  (await sent(backend, (r) => r.url === '/api/batches')).flush({
    items: [],
    total: 0,
    page: 1,
    pageSize: 100,
  });
  await harness.fixture.whenStable();
  return harness.routeNativeElement as HTMLElement;
}

// The first render compiles Material's date and select modules: slow on a busy machine.
describe('ComplaintPage', { timeout: 20_000 }, () => {
  // Dates follow the browser's language; en-GB here, and given back after each test, since the
  // spec files share one window and other pages' specs expect the default (en-US).
  beforeEach(() => vi.spyOn(globalThis.navigator, 'language', 'get').mockReturnValue('en-GB'));
  afterEach(() => vi.restoreAllMocks());

  it('shows the US reporting clock in plain words with its source and who decides', async () => {
    const el = await open(COMPLAINT);
    expect(el.querySelector('[data-testid=reporting-clock]')?.textContent?.trim()).toBe(
      'timer Report to FDA by Mon 14 Dec 2026 — 8 business days left.',
    );
    expect(el.textContent).toContain('FD&C Act §605(b)(1)');
    expect(el.textContent).toContain('You and your adviser decide');
    expect(el.textContent).toContain('Keep this record until at least');
  });

  it('says plainly when the report is overdue', async () => {
    const el = await open({
      ...COMPLAINT,
      usReportingClock: {
        ...COMPLAINT.usReportingClock!,
        businessDaysLeft: -1,
        overdue: true,
        state: 'overdue',
      },
    });
    expect(el.querySelector('[data-testid=reporting-clock]')?.textContent).toContain(
      'Overdue: the report to FDA was due by Mon 14 Dec 2026, 1 business day ago.',
    );
  });
});
