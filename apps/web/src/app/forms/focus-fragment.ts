import { DOCUMENT } from '@angular/common';
import { afterNextRender, effect, inject, Injector, type Signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ActivatedRoute } from '@angular/router';

/**
 * Focuses the field the URL's fragment names (`/formulas/:id/identity#euResponsiblePerson.address`
 * focuses the input whose id is `euResponsiblePerson.address`) once `ready()` holds, so a link
 * from a refusal lands the maker on the field to fill in. Call in an injection context.
 */
export function focusFragment(ready: Signal<boolean>): void {
  const fragment = toSignal(inject(ActivatedRoute).fragment);
  const document = inject(DOCUMENT);
  const injector = inject(Injector);
  effect(() => {
    const id = fragment();
    if (!id || !ready()) return;
    afterNextRender(
      () => {
        const target = document.getElementById(id);
        if (!target) return;
        target.scrollIntoView?.({ block: 'center' });
        target.focus();
      },
      { injector },
    );
  });
}
