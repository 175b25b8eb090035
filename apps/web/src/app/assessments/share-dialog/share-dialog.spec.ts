import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpRequest } from '@angular/common/http';
import type { HttpTestingController } from '@angular/common/http/testing';
import { Component, inject } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialog } from '@angular/material/dialog';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatRadioGroupHarness } from '@angular/material/radio/testing';
import type { ShareRecord } from '@batchproof/shared';
import { signedInAs } from '../../auth/signed-in-as';
import { VERSION_ID } from '../assessments-testing';
import { ShareDialog, type ShareDialogData } from './share-dialog';

@Component({ selector: 'bp-host', template: '' })
class Host {
  readonly dialog = inject(MatDialog);
}

const sent = (backend: HttpTestingController, match: (r: HttpRequest<unknown>) => boolean) =>
  vi.waitFor(() => backend.expectOne(match));

const member = (id: string, name: string, role: string) => ({
  id,
  name,
  email: `${name.split(' ')[0]!.toLowerCase()}@example.com`,
  role,
  joinedAt: '2026-01-01T00:00:00.000Z',
});

async function openDialog(members: ReturnType<typeof member>[]) {
  const backend = await signedInAs('owner', [{ path: 'workshop', component: Host }]);
  const fixture = TestBed.createComponent(Host);
  const data: ShareDialogData = {
    versionId: VERSION_ID,
    formulaName: 'Everyday Body Lotion',
    versionNumber: 2,
  };
  const ref = fixture.componentInstance.dialog.open<ShareDialog, ShareDialogData, ShareRecord>(
    ShareDialog,
    { data },
  );
  const closed = new Promise<ShareRecord | undefined>((resolve) =>
    ref.afterClosed().subscribe(resolve),
  );
  (await sent(backend, (r) => r.url === '/api/members')).flush({ items: members });
  await fixture.whenStable();
  const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
  const dialog = await root.getHarness(MatDialogHarness);
  return { backend, dialog, closed, fixture };
}

describe('ShareDialog', { timeout: 20_000 }, () => {
  it('lists only the assessor members and shares the version with the one chosen', async () => {
    const { backend, dialog, closed } = await openDialog([
      member('u1', 'Ada Marsh', 'owner'),
      member('u9', 'Wren Ashby', 'assessor'),
      member('u8', 'Bram Oakes', 'assessor'),
      member('u7', 'Cass Pole', 'viewer'),
    ]);
    const radios = await dialog.getHarness(MatRadioGroupHarness);
    const labels = await Promise.all((await radios.getRadioButtons()).map((r) => r.getLabelText()));
    expect(labels.map((l) => l.split(' ').slice(0, 2).join(' '))).toEqual([
      'Wren Ashby',
      'Bram Oakes',
    ]);
    const share = await dialog.getHarness(MatButtonHarness.with({ text: /^share\s*Share$/ }));
    expect(await share.isDisabled()).toBe(true);
    await radios.checkRadioButton({ label: /Wren Ashby/ });
    const clicking = share.click();
    const post = await sent(backend, (r) => r.url === '/api/assessment-shares');
    expect(post.request.body).toEqual({ versionId: VERSION_ID, assessorId: 'u9' });
    expect(post.request.headers.has('Idempotency-Key')).toBe(true);
    const record: ShareRecord = {
      id: '5a000000-0000-4000-8000-000000000001',
      formulaId: 'f1',
      formulaName: 'Everyday Body Lotion',
      versionId: VERSION_ID,
      versionNumber: 2,
      assessorId: 'u9',
      assessorName: 'Wren Ashby',
      sharedByName: 'Ada Marsh',
      sharedAt: '2026-12-03T08:00:00.000Z',
      assessmentId: null,
      assessmentStatus: null,
    };
    post.flush(record, { status: 201, statusText: 'Created' });
    await clicking;
    expect(await closed).toEqual(record);
  });

  it('says the version cannot be shared when the API refuses it, naming why', async () => {
    const { backend, dialog } = await openDialog([member('u9', 'Wren Ashby', 'assessor')]);
    await (await dialog.getHarness(MatRadioGroupHarness)).checkRadioButton({ label: /Wren/ });
    const clicking = (await dialog.getHarness(MatButtonHarness.with({ text: /Share$/ }))).click();
    (await sent(backend, (r) => r.url === '/api/assessment-shares')).flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Check the highlighted fields.',
          fieldErrors: { versionId: ['A draft cannot be shared: release it first'] },
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await clicking;
    expect(await dialog.getContentText()).toContain(
      'Check the highlighted fields. A draft cannot be shared: release it first',
    );
  });

  it('says when the workshop has no assessor and points to the Workshop page to invite one', async () => {
    const { dialog, backend } = await openDialog([member('u1', 'Ada Marsh', 'owner')]);
    expect(await dialog.getContentText()).toContain(
      'No member of this workshop has the assessor role yet.',
    );
    const buttons = await dialog.getAllHarnesses(MatButtonHarness);
    expect(await Promise.all(buttons.map((b) => b.getText()))).toEqual(['Cancel']);
    const link = document.querySelector<HTMLAnchorElement>('[data-testid=no-assessor] a');
    expect(link?.getAttribute('href')).toBe('/workshop');
    backend.verify();
  });
});
