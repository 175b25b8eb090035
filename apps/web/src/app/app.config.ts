import { provideHttpClient, withFetch, withInterceptors } from '@angular/common/http';
import {
  type ApplicationConfig,
  provideBrowserGlobalErrorListeners,
  provideZonelessChangeDetection,
} from '@angular/core';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS } from '@angular/material/form-field';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { routes } from './app.routes';
import { authInterceptor } from './auth/auth-interceptor';
import { errorInterceptor } from './http/error-interceptor';

/** The providers the app starts with. */
export const appConfig: ApplicationConfig = {
  providers: [
    provideBrowserGlobalErrorListeners(),
    provideZonelessChangeDetection(),
    provideRouter(routes, withComponentInputBinding()),
    // The error interceptor is outermost so the auth interceptor sees raw 401s (to refresh
    // once) and pages only ever see ApiError.
    provideHttpClient(withFetch(), withInterceptors([errorInterceptor, authInterceptor])),
    // A hint or error takes the lines it needs under its field instead of a fixed strip that a
    // long hint runs out of (over the next field, or cut off at the field's edge).
    { provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { subscriptSizing: 'dynamic' } },
  ],
};
