import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import type { Role } from '@batchproof/shared';
import { signedInAs } from '../auth/signed-in-as';
import { RecordActions } from './record-actions';

async function open(role: Role = 'formulator', archived: string | null = null) {
  const backend = await signedInAs(role);
  const fixture = TestBed.createComponent(RecordActions);
  fixture.componentRef.setInput('kind', 'materials');
  fixture.componentRef.setInput('recordId', 'm1');
  fixture.componentRef.setInput('name', 'Sea Glass Mica');
  fixture.componentRef.setInput('archived', archived);
  const events = { archived: [] as (string | null)[], deleted: 0 };
  fixture.componentInstance.archivedChange.subscribe((v) => events.archived.push(v));
  fixture.componentInstance.deleted.subscribe(() => events.deleted++);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const button = (text: string | RegExp) => loader.getHarness(MatButtonHarness.with({ text }));
  return { backend, fixture, events, loader, button };
}

describe('RecordActions', () => {
  it('archives the record and then offers to bring it back', async () => {
    const o = await open();
    await (await o.button(/Archive/)).click();
    const req = o.backend.expectOne('/api/materials/m1/archive');
    expect(req.request.method).toBe('POST');
    req.flush({ id: 'm1', archivedAt: '2026-12-01T09:00:00.000Z' });
    await vi.waitFor(() => expect(o.events.archived).toEqual(['2026-12-01T09:00:00.000Z']));
    await (await o.button(/Bring back/)).click();
    o.backend.expectOne('/api/materials/m1/unarchive').flush({ id: 'm1', archivedAt: null });
    await vi.waitFor(() => expect(o.events.archived).toEqual(['2026-12-01T09:00:00.000Z', null]));
    expect(await (await o.button(/Archive/)).getText()).toContain('Archive');
  });

  it('asks before deleting, and shows the API’s reason when something refers to the record', async () => {
    const o = await open();
    await (await o.button(/^delete\s*Delete$/)).click();
    o.backend.expectNone('/api/materials/m1');
    await (await o.button(/Delete for good/)).click();
    const reason =
      'This material cannot be deleted: 1 lot refers to it. Archive it instead: it leaves the ' +
      'lists and pickers, and what refers to it stays readable.';
    o.backend
      .expectOne((r) => r.method === 'DELETE' && r.url === '/api/materials/m1')
      .flush(
        { error: { code: 'conflict', message: reason } },
        { status: 409, statusText: 'Conflict' },
      );
    await vi.waitFor(() => {
      const alert = (o.fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
      expect(alert?.textContent).toContain(reason);
    });
    expect(o.events.deleted).toBe(0);
  });

  it('deletes once confirmed', async () => {
    const o = await open();
    await (await o.button(/^delete\s*Delete$/)).click();
    await (await o.button(/Delete for good/)).click();
    o.backend
      .expectOne((r) => r.method === 'DELETE' && r.url === '/api/materials/m1')
      .flush(null, { status: 204, statusText: 'No Content' });
    await vi.waitFor(() => expect(o.events.deleted).toBe(1));
  });

  it('offers nothing to a member who may not write', async () => {
    const o = await open('viewer');
    expect(await o.loader.getAllHarnesses(MatButtonHarness)).toEqual([]);
  });
});
