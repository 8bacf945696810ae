import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatMenuHarness } from '@angular/material/menu/testing';
import { provideRouter, Router } from '@angular/router';

import { errorInterceptor } from '../error-interceptor';
import type { SignedInUser } from '../models/user';
import { Session } from '../session';
import { Shell } from './shell';

const anonymous = () => ({
  body: { error: { code: 'unauthenticated', message: 'Not signed in.' } },
  opts: { status: 401, statusText: 'Unauthorized' },
});

const admin: SignedInUser = {
  id: 1,
  login: 'aokafor',
  name: 'Amara Okafor',
  role: 'admin',
  avatarUrl: null,
};
const editor: SignedInUser = {
  id: 2,
  login: 'lvoss',
  name: 'Lena Voss',
  role: 'editor',
  avatarUrl: null,
};

describe('Shell', () => {
  let fixture: ComponentFixture<Shell>;
  let backend: HttpTestingController;
  let element: HTMLElement;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [Shell],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Shell);
    element = fixture.nativeElement as HTMLElement;
  });

  afterEach(() => backend.verify());

  async function signIn(user: SignedInUser | null): Promise<void> {
    const known = TestBed.inject(Session).refresh();
    const request = backend.expectOne('/api/v1/me');
    if (user) request.flush(user);
    else request.flush(anonymous().body, anonymous().opts);
    await known;
    await fixture.whenStable();
  }

  const navLabels = () =>
    Array.from(element.querySelectorAll('nav[aria-label="Main"] a')).map((a) =>
      a.textContent?.trim(),
    );

  it('shows the product name and neither sign-in nor sign-out while the session is loading', async () => {
    TestBed.inject(Session).refresh();
    await fixture.whenStable();

    expect(element.querySelector('.brand-name')?.textContent).toBe('Thalpos');
    expect(element.textContent).not.toContain('Sign in');
    expect(element.textContent).not.toContain('Sign out');
    backend.expectOne('/api/v1/me').flush(admin);
  });

  it('offers an anonymous visitor Home, Browse, Calculate and Releases, and a full-page sign-in link', async () => {
    await signIn(null);

    expect(navLabels()).toEqual(['Home', 'Browse', 'Calculate', 'Releases']);
    const signInLink = Array.from(element.querySelectorAll('a')).find((a) =>
      a.textContent?.includes('Sign in'),
    );
    expect(signInLink?.getAttribute('href')).toBe('/auth/github?returnTo=%2F');
    expect(element.textContent).not.toContain('Sign out');
  });

  it('shows an admin the Admin link, their name and their role chip', async () => {
    await signIn(admin);

    expect(navLabels()).toEqual([
      'Home',
      'Browse',
      'Calculate',
      'Releases',
      'Curation',
      'Sources',
      'Integrate',
      'Audit log',
      'Admin',
    ]);
    expect(element.querySelector('nav a[href="/admin/users"]')).not.toBeNull();
    expect(element.querySelector('.user-name')?.textContent).toBe('Amara Okafor');
    expect(element.querySelector('.role-chip')?.textContent?.trim()).toBe('admin');
    expect(element.textContent).not.toContain('Sign in');
  });

  it('hides the Admin link from other roles', async () => {
    await signIn(editor);

    expect(navLabels()).toEqual([
      'Home',
      'Browse',
      'Calculate',
      'Releases',
      'Curation',
      'Sources',
      'Integrate',
      'Audit log',
    ]);
    expect(element.querySelector('.role-chip')?.textContent?.trim()).toBe('editor');
  });

  it('shows the Audit log link to editors and admins only', async () => {
    await signIn(editor);
    expect(navLabels()).toContain('Audit log');
    expect(element.querySelector('nav a[href="/audit"]')).not.toBeNull();
  });

  it.each(['reader', 'curator'] as const)('hides the Audit log link from a %s', async (role) => {
    await signIn({ ...editor, role });
    expect(navLabels()).not.toContain('Audit log');
  });

  it.each(['curator', 'editor', 'admin'] as const)(
    'shows the Sources link to a %s',
    async (role) => {
      await signIn({ ...editor, role });
      expect(element.querySelector('nav a[href="/sources"]')?.textContent?.trim()).toBe('Sources');
    },
  );

  it('hides the Sources link from a reader', async () => {
    await signIn({ ...editor, role: 'reader' });
    expect(navLabels()).not.toContain('Sources');
  });

  it('offers Settings in the account menu of a signed-in user', async () => {
    await signIn({ ...editor, role: 'reader' });
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const menu = await loader.getHarness(MatMenuHarness.with({ selector: '.account-menu' }));
    await menu.open();
    const [settings] = await menu.getItems();
    expect(await settings.getText()).toContain('Settings');
    expect(await (await settings.host()).getAttribute('href')).toBe('/settings');
  });

  it('signs out with POST /auth/logout, reloads the session and goes home', async () => {
    await signIn(admin);
    const router = TestBed.inject(Router);
    const navigate = jest.spyOn(router, 'navigateByUrl');
    const loader = TestbedHarnessEnvironment.loader(fixture);

    await (await loader.getHarness(MatButtonHarness.with({ text: /Sign out/ }))).click();
    backend
      .expectOne({ method: 'POST', url: '/auth/logout' })
      .flush(null, { status: 204, statusText: 'No Content' });
    await new Promise((resolve) => setTimeout(resolve));
    backend.expectOne('/api/v1/me').flush(anonymous().body, anonymous().opts);
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();

    expect(navigate).toHaveBeenCalledWith('/');
    expect(element.textContent).toContain('Sign in');
    expect(element.querySelector('.user-name')).toBeNull();
    expect(navLabels()).toEqual(['Home', 'Browse', 'Calculate', 'Releases']);
  });

  it('sends sign-in back to the current page with its query', async () => {
    await TestBed.inject(Router).navigateByUrl('/?target=H2(g)');
    await signIn(null);
    const signInLink = Array.from(element.querySelectorAll('a')).find((a) =>
      a.textContent?.includes('Sign in'),
    );
    expect(signInLink?.getAttribute('href')).toBe('/auth/github?returnTo=%2F%3Ftarget%3DH2(g)');
  });

  it('does not show a busy server (429 on /api/v1/me) as signed out', async () => {
    const known = TestBed.inject(Session).refresh();
    backend
      .expectOne('/api/v1/me')
      .flush(
        { error: { code: 'rate_limited', message: 'Too many requests' } },
        { status: 429, statusText: 'Too Many Requests', headers: { 'Retry-After': '10' } },
      );
    await known;
    await fixture.whenStable();
    expect(element.textContent).not.toContain('Sign in');
    expect(element.textContent).toContain('Account: check again');
  });

  it.each([
    ['reader', false],
    ['curator', true],
    ['editor', true],
  ] as const)('shows the Curation link to a %s: %s', async (role, shown) => {
    await signIn({ ...editor, role });
    expect(navLabels().includes('Curation')).toBe(shown);
    expect(element.querySelector('nav a[href="/curation"]') !== null).toBe(shown);
  });
});
