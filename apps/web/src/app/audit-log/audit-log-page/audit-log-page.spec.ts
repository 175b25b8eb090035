import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import { signedInAs } from '../../auth/signed-in-as';
import AuditLogPage from './audit-log-page';

const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

describe('AuditLogPage', { timeout: 20_000 }, () => {
  it('lists the filtered log with names, and exports it with the same filters', async () => {
    const backend = await signedInAs('owner', [{ path: 'audit-log', component: AuditLogPage }]);
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/audit-log?subjectType=complaint&from=2026-11-20');
    const list = await sent(backend, (r) => r.url === '/api/audit-events');
    expect(list.request.params.get('subjectType')).toBe('complaint');
    expect(list.request.params.get('from')).toBe('2026-11-20');
    list.flush({
      items: [
        {
          id: 'e1',
          at: '2026-11-20T10:00:00.000Z',
          actorId: 'u1',
          actorName: 'Ada Marsh',
          action: 'complaint.created',
          subjectType: 'complaint',
          subjectId: 'c1',
          detail: { serious: true },
        },
      ],
      total: 1,
      page: 1,
      pageSize: 25,
    });
    await harness.fixture.whenStable();
    const el = harness.routeNativeElement as HTMLElement;
    expect(el.querySelector('tbody tr')?.textContent).toContain('Ada Marsh');
    expect(el.querySelector('tbody tr')?.textContent).toContain('Complaint');

    const button = Array.from(el.querySelectorAll('button')).find((b) =>
      b.textContent?.includes('Export CSV'),
    )!;
    button.click();
    const csv = await sent(backend, (r) => r.url === '/api/audit-events/export.csv');
    expect(csv.request.params.get('subjectType')).toBe('complaint');
    expect(csv.request.params.get('from')).toBe('2026-11-20');
    expect(csv.request.params.has('page')).toBe(false);
  });
});
