import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, Router } from '@angular/router';

import type { DraftList } from '@contracts/releases/release-drafts-schemas';
import { errorInterceptor } from '../../../../core/error-interceptor';
import { DraftsPage } from './drafts-page';

const list: DraftList = {
  drafts: [
    {
      version: '2026.3',
      status: 'draft',
      notes: '',
      base: '2026.2',
      stale: false,
      latest: '2026.2',
      createdAt: '2026-12-01T10:00:00.000Z',
      createdBy: { login: 'demo-editor', name: 'Helga Brandt' },
    },
  ],
};

describe('DraftsPage', () => {
  let fixture: ComponentFixture<DraftsPage>;
  let backend: HttpTestingController;
  let loader: HarnessLoader;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [DraftsPage],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(DraftsPage);
    loader = TestbedHarnessEnvironment.loader(fixture);
    backend.expectOne('/api/v1/releases/drafts').flush(list);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
  const field = (placeholder: string) => loader.getHarness(MatInputHarness.with({ placeholder }));

  it('lists the drafts in progress with their base release', () => {
    expect(text()).toContain('2026.3');
    expect(text()).toContain('based on 2026.2');
    expect(text()).toContain('by Helga Brandt');
  });

  it('starts a draft and opens it', async () => {
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await (await field('2026.3')).setValue('2026.4');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Start draft/ }))).click();
    const req = backend.expectOne({ method: 'POST', url: '/api/v1/releases' });
    expect(req.request.body).toEqual({ version: '2026.4', notes: '' });
    req.flush({ release: { ...list.drafts[0], version: '2026.4' }, counts: {}, changes: [] });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/releases/drafts', '2026.4']);
  });

  it('refuses a malformed version before asking the server', async () => {
    await (await field('2026.3')).setValue('next');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Start draft/ }))).click();
    await fixture.whenStable();
    expect(text()).toContain('Write the version as year, dot, number');
  });

  it('says so when the version is taken', async () => {
    await (await field('2026.3')).setValue('2026.2');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Start draft/ }))).click();
    backend
      .expectOne({ method: 'POST', url: '/api/v1/releases' })
      .flush(
        { error: { code: 'version_taken', message: 'taken', version: '2026.2' } },
        { status: 409, statusText: 'Conflict' },
      );
    await fixture.whenStable();
    expect(text()).toContain('Release 2026.2 already exists: choose another version.');
  });
});
