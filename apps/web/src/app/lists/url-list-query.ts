import type { HttpResourceRef } from '@angular/common/http';
import { computed, DestroyRef, inject, linkedSignal, type Signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import type { PageEvent } from '@angular/material/paginator';
import type { Sort } from '@angular/material/sort';
import { ActivatedRoute, Router } from '@angular/router';
import { debounceTime, distinctUntilChanged, skip } from 'rxjs';
import type { z } from 'zod';

/** The fields every server-side list query shares (see `libs/shared/src/lists`). */
interface ListQueryShape {
  q?: string;
  sort: string;
  dir: 'asc' | 'desc';
  page: number;
  pageSize: number;
}

type ParamValue = string | number | null;

/** The URL's query parameters as text, a missing or empty one as undefined. */
export type UrlParams = Record<string, string | undefined>;

/** How a list reads its URL when the parameters are not the query's fields one to one. */
export interface UrlListQueryOptions {
  /**
   * Turns the URL's parameters into the object the schema parses: for a parameter the URL names
   * differently from the query (a filter word the page turns into a date), or a default that
   * depends on another parameter. When the result does not parse, the schema's defaults apply.
   */
  fromUrl?: (params: UrlParams) => Record<string, unknown>;
}

/**
 * The state of a table that sorts, filters and pages on the server, kept in the URL's query
 * parameters so it survives reloads and can be shared. Call in a component's field initialiser.
 *
 * `query` is the URL parsed with the list's shared zod schema (its defaults when a parameter is
 * missing or wrong); `filterText` is what the filter box shows, and the URL follows it after a
 * short pause in typing.
 */
export function injectUrlListQuery<T extends ListQueryShape>(
  schema: z.ZodType<T>,
  options: UrlListQueryOptions = {},
) {
  const route = inject(ActivatedRoute);
  const router = inject(Router);
  const paramMap = toSignal(route.queryParamMap, { requireSync: true });

  const params = computed<UrlParams>(() => {
    const map = paramMap();
    return Object.fromEntries(map.keys.map((k) => [k, map.get(k) || undefined]));
  });
  const query = computed(() => {
    const raw = params();
    const parsed = schema.safeParse(options.fromUrl ? options.fromUrl(raw) : raw);
    return parsed.success ? parsed.data : schema.parse({});
  });

  const navigate = (queryParams: Record<string, ParamValue>) =>
    void router.navigate([], {
      relativeTo: route,
      queryParams,
      queryParamsHandling: 'merge',
      replaceUrl: true,
    });

  const filterText = linkedSignal(() => query().q ?? '');
  toObservable(filterText)
    .pipe(
      skip(1),
      debounceTime(300),
      distinctUntilChanged(),
      takeUntilDestroyed(inject(DestroyRef)),
    )
    .subscribe((q) => navigate({ q: q || null, page: null }));

  return {
    query,
    /** The URL's query parameters as they stand, before parsing. */
    params,
    filterText,
    navigate,
    /** Sets one filter (or clears it with an empty value) and goes back to the first page. */
    filterBy(key: string, value: ParamValue | undefined) {
      navigate({ [key]: value === '' || value === undefined ? null : value, page: null });
    },
    /**
     * Clears the named filters and goes back to the first page. Clearing `q` empties the filter
     * box at once, so text still waiting for the pause in typing cannot bring it back.
     */
    clearFilters(keys: readonly string[]) {
      if (keys.includes('q')) filterText.set('');
      navigate({ ...Object.fromEntries(keys.map((k) => [k, null])), page: null });
    },
    /** Follows a `matSortChange`; no direction means the list's default order. */
    sortBy(sort: Sort) {
      navigate({
        sort: sort.direction ? sort.active : null,
        dir: sort.direction || null,
        page: null,
      });
    },
    /** Follows a paginator's `page` event. */
    changePage(event: PageEvent) {
      navigate({ page: event.pageIndex + 1, pageSize: event.pageSize });
    },
  };
}

/**
 * The last value a resource loaded, kept while the next one loads so a table does not flicker
 * back to empty between pages.
 */
export function keepLastValue<T>(resource: HttpResourceRef<T | undefined>): Signal<T | undefined> {
  return linkedSignal<T | undefined, T | undefined>({
    source: () => (resource.hasValue() ? resource.value() : undefined),
    computation: (value, previous) => value ?? previous?.value,
  });
}
