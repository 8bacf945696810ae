import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';

import type { SettingsAnswer } from '@contracts/users/users-schemas';

import { errorInterceptor } from '../../../core/error-interceptor';
import { SettingsPage } from './settings-page';

const on: SettingsAnswer = { emailNotifications: true, email: 'priya.n@kestrel.example' };

describe('SettingsPage', () => {
  let fixture: ComponentFixture<SettingsPage>;
  let backend: HttpTestingController;
  let loader: HarnessLoader;
  let rootLoader: HarnessLoader;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [SettingsPage],
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SettingsPage);
    loader = TestbedHarnessEnvironment.loader(fixture);
    rootLoader = TestbedHarnessEnvironment.documentRootLoader(fixture);
  });

  afterEach(() => backend.verify());

  async function load(settings: SettingsAnswer = on): Promise<void> {
    backend.expectOne({ method: 'GET', url: '/api/v1/me/settings' }).flush(settings);
    await fixture.whenStable();
  }
  const toggle = () =>
    loader.getHarness(MatSlideToggleHarness.with({ label: 'E-mail me about proposals' }));
  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';

  it('shows the stored setting and the address messages go to', async () => {
    await load();
    expect(await (await toggle()).isChecked()).toBe(true);
    expect(text()).toContain('Messages go to priya.n@kestrel.example');
  });

  it('says so when there is no address to send to', async () => {
    await load({ emailNotifications: true, email: null });
    expect(text()).toContain('Your GitHub account shares no e-mail address');
  });

  it('saves a switch with PATCH /api/v1/me/settings and confirms it', async () => {
    await load();
    await (await toggle()).toggle();

    const patch = backend.expectOne({ method: 'PATCH', url: '/api/v1/me/settings' });
    expect(patch.request.body).toEqual({ emailNotifications: false });
    expect(await (await toggle()).isDisabled()).toBe(true);
    patch.flush({ ...on, emailNotifications: false });
    await fixture.whenStable();

    expect(await (await toggle()).isChecked()).toBe(false);
    expect(await (await toggle()).isDisabled()).toBe(false);
    expect(await (await rootLoader.getHarness(MatSnackBarHarness)).getMessage()).toBe(
      'E-mail notifications are off',
    );
  });

  it('puts the switch back and says why when the server refuses', async () => {
    await load();
    await (await toggle()).toggle();
    backend
      .expectOne('/api/v1/me/settings')
      .flush(
        { error: { code: 'unauthenticated', message: 'Sign in first' } },
        { status: 401, statusText: 'Unauthorized' },
      );
    await fixture.whenStable();

    expect(await (await toggle()).isChecked()).toBe(true);
    expect(await (await rootLoader.getHarness(MatSnackBarHarness)).getMessage()).toBe(
      'Setting not saved: Sign in first',
    );
  });

  it('says why the settings could not be loaded and loads them again on request', async () => {
    backend
      .expectOne('/api/v1/me/settings')
      .flush(
        { error: { code: 'internal', message: 'The database is not answering.' } },
        { status: 503, statusText: 'Service Unavailable' },
      );
    await fixture.whenStable();
    const alert = (fixture.nativeElement as HTMLElement).querySelector('[role="alert"]');
    expect(alert?.textContent).toContain('Could not load your settings');
    (alert?.querySelector('button') as HTMLButtonElement).click();
    await load();
    expect(await (await toggle()).isChecked()).toBe(true);
  });
});
