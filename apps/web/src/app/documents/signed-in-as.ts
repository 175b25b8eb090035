import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';
import type { Role } from '@batchproof/shared';
import { Session } from '../auth/session';

/**
 * For component tests: signs a member of `role` in through the real {@link Session}, answering
 * the sign-in request from the testing backend. Call after configuring the TestBed with
 * `provideHttpClient()` and `provideHttpClientTesting()`.
 */
export async function signedInAs(role: Role): Promise<void> {
  const signingIn = firstValueFrom(
    TestBed.inject(Session).signIn({ email: 'me@example.com', password: 'x' }),
  );
  TestBed.inject(HttpTestingController)
    .expectOne('/api/auth/sign-in')
    .flush({
      accessToken: 'token-1',
      expiresIn: 900,
      user: {
        id: 'u1',
        name: 'Ada Marsh',
        email: 'me@example.com',
        role,
        workshop: { id: 'w1', name: 'Hollowmere Bathworks' },
      },
    });
  await signingIn;
}

/** Puts `file` on a native file input and fires `change`, as picking it in the browser does. */
export function pickFile(input: HTMLInputElement, file: File): void {
  Object.defineProperty(input, 'files', { value: [file], configurable: true });
  input.dispatchEvent(new Event('change'));
}
