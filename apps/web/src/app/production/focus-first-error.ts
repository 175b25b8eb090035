import { afterNextRender, type Injector } from '@angular/core';

/**
 * Moves focus to the first field showing a message once the view shows it, so a keyboard or
 * screen-reader user lands on what to put right. Fields outside a form field mark themselves
 * with `data-field-error`.
 */
export function focusFirstError(host: HTMLElement, injector: Injector): void {
  afterNextRender(
    () => {
      const target = host.querySelector<HTMLElement>(
        '.mat-form-field-invalid input, .mat-form-field-invalid textarea, .mat-form-field-invalid mat-select, [data-field-error]',
      );
      target?.scrollIntoView?.({ block: 'center' });
      target?.focus();
    },
    { injector },
  );
}
