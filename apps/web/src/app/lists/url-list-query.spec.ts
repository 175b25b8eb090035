import { ChangeDetectionStrategy, Component, provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { listQuerySchema } from '@batchproof/shared';
import * as z from 'zod';
import { injectUrlListQuery, type UrlListQueryOptions } from './url-list-query';

const schema = listQuerySchema(['name', 'updatedAt'], 'name').extend({
  kind: z.enum(['a', 'b']).optional(),
});

let options: UrlListQueryOptions = {};

@Component({ template: '', changeDetection: ChangeDetectionStrategy.OnPush })
class ListHost {
  readonly list = injectUrlListQuery(schema, options);
}

async function open(url: string) {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideRouter([{ path: 'list', component: ListHost }]),
    ],
  });
  const harness = await RouterTestingHarness.create();
  const host = await harness.navigateByUrl(url, ListHost);
  const router = TestBed.inject(Router);
  return { harness, list: host.list, url: () => router.url };
}

describe('injectUrlListQuery', () => {
  afterEach(() => (options = {}));

  it('parses the query from the URL with the shared schema', async () => {
    const { list } = await open('/list?q=mica&kind=b&sort=updatedAt&dir=desc&page=3&pageSize=50');
    expect(list.query()).toEqual({
      q: 'mica',
      kind: 'b',
      sort: 'updatedAt',
      dir: 'desc',
      page: 3,
      pageSize: 50,
    });
    expect(list.filterText()).toBe('mica');
  });

  it('falls back to the schema defaults when a parameter is wrong', async () => {
    const { list } = await open('/list?q=mica&sort=colour&page=0');
    expect(list.query()).toEqual({ q: '', sort: 'name', dir: 'asc', page: 1, pageSize: 25 });
  });

  it('treats an empty parameter as a missing one', async () => {
    const { list } = await open('/list?kind=&sort=&page=2');
    expect(list.query()).toEqual({ q: '', sort: 'name', dir: 'asc', page: 2, pageSize: 25 });
  });

  it('lets the page turn URL parameters into query fields before parsing', async () => {
    options = { fromUrl: (p) => ({ ...p, dir: p['dir'] ?? 'desc', kind: p['type'] }) };
    const { list } = await open('/list?type=a');
    expect(list.query()).toMatchObject({ kind: 'a', dir: 'desc' });
    expect(list.params()).toEqual({ type: 'a' });
  });

  it('writes the filter text into q after a pause in typing, back on the first page', async () => {
    const { harness, list, url } = await open('/list?sort=updatedAt&page=3');
    list.filterText.set('m');
    list.filterText.set('mica');
    await harness.fixture.whenStable();
    expect(url()).toBe('/list?sort=updatedAt&page=3');

    await vi.waitFor(() => expect(url()).toBe('/list?sort=updatedAt&q=mica'));
    expect(list.query().q).toBe('mica');

    list.filterText.set('');
    await vi.waitFor(() => expect(url()).toBe('/list?sort=updatedAt'));
  });

  it('sorts by a column, and clears the sort when the direction is empty', async () => {
    const { harness, list, url } = await open('/list?page=2');
    list.sortBy({ active: 'updatedAt', direction: 'desc' });
    await harness.fixture.whenStable();
    expect(url()).toBe('/list?sort=updatedAt&dir=desc');

    list.sortBy({ active: 'updatedAt', direction: '' });
    await harness.fixture.whenStable();
    expect(url()).toBe('/list');
    expect(list.query()).toMatchObject({ sort: 'name', dir: 'asc' });
  });

  it('filters, clears filters and changes page through the URL', async () => {
    const { harness, list, url } = await open('/list?q=mica&page=4');
    list.filterBy('kind', 'a');
    await harness.fixture.whenStable();
    expect(url()).toBe('/list?q=mica&kind=a');

    list.changePage({ pageIndex: 1, pageSize: 50, length: 200 });
    await harness.fixture.whenStable();
    expect(url()).toBe('/list?q=mica&kind=a&page=2&pageSize=50');

    list.clearFilters(['q', 'kind']);
    expect(list.filterText()).toBe('');
    await harness.fixture.whenStable();
    expect(url()).toBe('/list?pageSize=50');
  });
});
