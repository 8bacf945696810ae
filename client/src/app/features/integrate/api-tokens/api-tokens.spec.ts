import { Clipboard } from '@angular/cdk/clipboard';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';

import type { TokenView } from '@contracts/tokens/tokens-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import { ApiTokens } from './api-tokens';

const tokens: TokenView[] = [
  {
    id: 4,
    name: 'Plant model sync',
    prefix: 'thp_0a1b2c3d4e5f6789',
    createdAt: '2026-03-02T08:00:00.000Z',
    lastUsedAt: '2026-03-05T06:30:00.000Z',
  },
  {
    id: 7,
    name: 'Spreadsheet',
    prefix: 'thp_fedcba9876543210',
    createdAt: '2026-04-11T10:00:00.000Z',
    lastUsedAt: null,
  },
];
const secret = 'thp_1111222233334444_' + 'k'.repeat(43);

// Harness typing through several fields takes a while on a busy machine: wait, never race.
jest.setTimeout(60_000);

describe('ApiTokens', () => {
  let fixture: ComponentFixture<ApiTokens>;
  let backend: HttpTestingController;
  let loader: HarnessLoader;
  let rootLoader: HarnessLoader;
  let copy: jest.Mock;

  beforeEach(async () => {
    copy = jest.fn(() => true);
    TestBed.configureTestingModule({
      imports: [ApiTokens],
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: Clipboard, useValue: { copy } },
        // Dialogs close at once, so what follows a closed dialog can be checked straight away.
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ApiTokens);
    loader = TestbedHarnessEnvironment.loader(fixture);
    rootLoader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    backend.expectOne({ method: 'GET', url: '/api/v1/me/tokens' }).flush({ tokens });
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';

  it('lists tokens by name and prefix, with their last use', () => {
    expect(text()).toContain('Plant model sync');
    expect(text()).toContain('thp_0a1b2c3d4e5f6789…');
    expect(text()).toContain('Last used 2026-03-05');
    expect(text()).toMatch(/Last used\s+never/);
    expect(text()).not.toContain(secret);
  });

  it('creates a token and shows it once in a dialog, with a copy button', async () => {
    await (await loader.getHarness(MatInputHarness)).setValue('  Nightly export ');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Create token/ }))).click();
    const post = backend.expectOne({ method: 'POST', url: '/api/v1/me/tokens' });
    expect(post.request.body).toEqual({ name: 'Nightly export' });
    post.flush({
      token: secret,
      apiToken: {
        id: 9,
        name: 'Nightly export',
        prefix: 'thp_1111222233334444',
        createdAt: '2026-05-01T00:00:00.000Z',
        lastUsedAt: null,
      },
    });
    await fixture.whenStable();

    const dialog = await rootLoader.getHarness(MatDialogHarness);
    expect(await dialog.getText()).toContain(secret);
    expect(await dialog.getText()).toContain('you will not see it again');
    await (await dialog.getHarness(MatButtonHarness.with({ text: /Copy token/ }))).click();
    expect(copy).toHaveBeenCalledWith(secret);
    expect(await dialog.getText()).toContain('Copied');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Done' }))).click();
    await fixture.whenStable();

    expect(await rootLoader.getAllHarnesses(MatDialogHarness)).toHaveLength(0);
    // The emptied name field is ready for the next token, not marked as an error.
    expect(await (await loader.getHarness(MatInputHarness)).getValue()).toBe('');
    expect(text()).not.toContain('Give the token a name');
    expect(text()).toContain('Nightly export');
    expect(text()).not.toContain(secret);
  });

  it('does not create a token without a name', async () => {
    await (await loader.getHarness(MatButtonHarness.with({ text: /Create token/ }))).click();
    backend.expectNone('/api/v1/me/tokens');
    expect(text()).toContain('Give the token a name');
  });

  it('revokes a token only after confirming', async () => {
    await (
      await loader.getHarness(
        MatButtonHarness.with({ text: /Revoke/, selector: '[aria-label="Revoke Spreadsheet"]' }),
      )
    ).click();
    let dialog = await rootLoader.getHarness(MatDialogHarness);
    expect(await dialog.getText()).toContain('thp_fedcba9876543210');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Cancel' }))).click();
    await fixture.whenStable();
    backend.expectNone({ method: 'DELETE' });

    await (
      await loader.getHarness(
        MatButtonHarness.with({ selector: '[aria-label="Revoke Spreadsheet"]' }),
      )
    ).click();
    dialog = await rootLoader.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Revoke' }))).click();
    await fixture.whenStable();
    backend
      .expectOne({ method: 'DELETE', url: '/api/v1/me/tokens/7' })
      .flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();

    expect(text()).not.toContain('Spreadsheet');
    const snackBar = await rootLoader.getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toBe('Token “Spreadsheet” revoked');
  });

  it("shows the server's refusal when a token cannot be created", async () => {
    await (await loader.getHarness(MatInputHarness)).setValue('One too many');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Create token/ }))).click();
    backend
      .expectOne('/api/v1/me/tokens')
      .flush(
        { error: { code: 'token_limit', message: 'You already hold 50 active tokens' } },
        { status: 409, statusText: 'Conflict' },
      );
    await fixture.whenStable();
    const snackBar = await rootLoader.getHarness(MatSnackBarHarness);
    expect(await snackBar.getMessage()).toBe(
      'Token not created: You already hold 50 active tokens',
    );
  });
});
