import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component, provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import SignUpPage from './sign-up-page';
import { errorInterceptor } from '../../http/error-interceptor';

@Component({ template: '' })
class Elsewhere {}

async function openSignUp() {
  TestBed.configureTestingModule({
    providers: [
      provideZonelessChangeDetection(),
      provideRouter([{ path: '**', component: Elsewhere }]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
    ],
  });
  const fixture = TestBed.createComponent(SignUpPage);
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.loader(fixture);
  const field = (label: string) =>
    loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  return {
    fixture,
    field,
    errors: async (label: string) => (await field(label)).getTextErrors(),
    fill: async (label: string, value: string) =>
      ((await (await field(label)).getControl()) as MatInputHarness).setValue(value),
    submit: async () =>
      (await loader.getHarness(MatButtonHarness.with({ text: 'Create workshop' }))).click(),
    backend: TestBed.inject(HttpTestingController),
  };
}

describe('SignUpPage', () => {
  beforeEach(() => localStorage.clear());

  it("shows the shared schema's messages beside each field and sends nothing", async () => {
    const page = await openSignUp();
    await page.fill('E-mail', 'not-an-address');
    await page.fill('Password', 'short');
    await page.submit();

    expect(await page.errors('Workshop name')).toEqual(['Workshop name is required.']);
    expect(await page.errors('Your name')).toEqual(['Name is required.']);
    expect(await page.errors('E-mail')).toEqual(['Enter a valid e-mail address.']);
    expect(await page.errors('Password')).toEqual(['Use at least 10 characters.']);
    page.backend.expectNone('/api/auth/sign-up');
  });

  it('marks the invalid inputs for assistive technology', async () => {
    const page = await openSignUp();
    await page.submit();

    const input = page.fixture.nativeElement.querySelector(
      'input[formcontrolname=email]',
    ) as HTMLInputElement;
    expect(input.getAttribute('aria-invalid')).toBe('true');
  });

  it('clears a message once the field is corrected', async () => {
    const page = await openSignUp();
    await page.submit();
    await page.fill('Workshop name', 'Hollowmere Bathworks');

    expect(await page.errors('Workshop name')).toEqual([]);
  });

  it('sends the trimmed, lower-cased values and then says where the confirmation link went', async () => {
    const page = await openSignUp();
    await page.fill('Workshop name', ' Hollowmere Bathworks ');
    await page.fill('Your name', 'Ada Marsh');
    await page.fill('E-mail', 'Ada@Example.com');
    await page.fill('Password', 'a-long-enough-password');
    await page.submit();

    const req = page.backend.expectOne('/api/auth/sign-up');
    expect(req.request.body).toEqual({
      workshopName: 'Hollowmere Bathworks',
      name: 'Ada Marsh',
      email: 'ada@example.com',
      password: 'a-long-enough-password',
    });
    req.flush(
      { message: 'We sent a link to ada@example.com. Open it to confirm the address.' },
      { status: 202, statusText: 'Accepted' },
    );
    await page.fixture.whenStable();

    const status = page.fixture.nativeElement.querySelector('[role=status]') as HTMLElement;
    expect(status.textContent).toContain('We sent a link to ada@example.com');
    expect(localStorage.length).toBe(0);
  });
});
