import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import { signedInAs } from '../../auth/signed-in-as';
import ComplaintList from './complaint-list';

const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

describe('ComplaintList', { timeout: 20_000 }, () => {
  // Dates follow the browser's language; en-GB here, and given back after each test, since the
  // spec files share one window and other pages' specs expect the default (en-US).
  beforeEach(() => vi.spyOn(globalThis.navigator, 'language', 'get').mockReturnValue('en-GB'));
  afterEach(() => vi.restoreAllMocks());

  it('shows each complaint with its clock in words, and filters through the URL', async () => {
    const backend = await signedInAs('viewer', [{ path: 'complaints', component: ComplaintList }]);
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/complaints?serious=true');
    (await sent(backend, (r) => r.url === '/api/formulas')).flush({
      items: [],
      total: 0,
      page: 1,
      pageSize: 100,
    });
    const list = await sent(backend, (r) => r.url === '/api/complaints');
    expect(list.request.params.get('serious')).toBe('true');
    list.flush({
      items: [
        {
          id: 'c1',
          createdAt: '2026-11-20T10:00:00.000Z',
          updatedAt: '2026-11-20T10:00:00.000Z',
          formulaId: 'f1',
          productName: 'Sea Glass Fizzer',
          batchId: 'b1',
          batchCode: '261101-SGF-1',
          finishedLotCode: null,
          receivedOn: '2026-11-20',
          reporterName: null,
          reporterContact: null,
          whatHappened: 'Blisters',
          bodyArea: null,
          serious: true,
          status: 'open',
          followUpNotes: null,
          reportedToFdaOn: null,
          usReportingClock: {
            dueOn: '2026-12-14',
            businessDaysLeft: 8,
            overdue: false,
            state: 'running',
            reportedOn: null,
            source: 'FD&C Act §605(b)(1), 21 U.S.C. 364a(b)(1)',
          },
          retention: null,
        },
      ],
      total: 1,
      page: 1,
      pageSize: 25,
    });
    await harness.fixture.whenStable();
    const row = (harness.routeNativeElement as HTMLElement).querySelector('tbody tr');
    expect(row?.textContent).toContain('261101-SGF-1');
    expect(row?.textContent).toContain('Report to FDA by Mon 14 Dec 2026 — 8 business days left.');
  });
});
