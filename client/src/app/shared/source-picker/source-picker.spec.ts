import { provideHttpClient, withInterceptors } from '@angular/common/http';
import {
  HttpTestingController,
  provideHttpClientTesting,
  type TestRequest,
} from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteHarness } from '@angular/material/autocomplete/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatInputHarness } from '@angular/material/input/testing';

import type { SourceAnswer } from '@contracts/sources/sources-schemas';
import { errorInterceptor } from '../../core/error-interceptor';
import { SourcePicker } from './source-picker';

@Component({
  imports: [ReactiveFormsModule, SourcePicker],
  template: `<thalpos-source-picker
    [formControl]="sourceId"
    label="Source of the value"
    (sourceChange)="changes.push($event)"
  />`,
})
class Host {
  readonly sourceId = new FormControl<string | null>(null);
  readonly changes: (SourceAnswer | null)[] = [];
}

// The first test compiles the picker and the dialog; a busy machine makes that slow, never wrong.
jest.setTimeout(30_000);

const codata: SourceAnswer = {
  id: '3',
  citation:
    'Cox, J. D., Wagman, D. D., & Medvedev, V. A. (1989). CODATA Key Values for Thermodynamics. Hemisphere Publishing Corp.',
  doi: null,
};

describe('SourcePicker', () => {
  let backend: HttpTestingController;

  function setUp(initial: string | null = null) {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.sourceId.setValue(initial);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const root = TestbedHarnessEnvironment.documentRootLoader(fixture);
    return { fixture, loader, root, host: fixture.componentInstance };
  }

  /** The search is debounced: waits until the request is out, then answers it. */
  async function request(url: (u: string) => boolean): Promise<TestRequest> {
    for (;;) {
      const [found] = backend.match((r) => url(r.urlWithParams));
      if (found) return found;
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
  }

  async function until(check: () => boolean, fixture: { whenStable(): Promise<unknown> }) {
    while (!check()) {
      await fixture.whenStable();
      await new Promise((resolve) => setTimeout(resolve, 10));
    }
  }

  afterEach(() => backend.verify());

  it('searches the registered sources and sets the control to the chosen id', async () => {
    const { fixture, loader, host } = setUp();
    const auto = await loader.getHarness(MatAutocompleteHarness);
    await auto.enterText('codata');
    const search = await request((u) => u.startsWith('/api/v1/sources?'));
    expect(search.request.params.get('q')).toBe('codata');
    search.flush({ items: [codata], total: 1 });
    // The panel shows once the answer brings options.
    while (!(await auto.isOpen())) {
      await auto.focus();
      await new Promise((resolve) => setTimeout(resolve, 10));
    }
    await auto.selectOption({ text: /CODATA Key Values/ });
    expect(host.sourceId.value).toBe('3');
    expect(host.changes).toEqual([codata]);
    await until(() => fixture.nativeElement.textContent.includes('Choose another'), fixture);
    expect(fixture.nativeElement.querySelector('.citation').textContent).toContain(
      'CODATA Key Values for Thermodynamics',
    );
  });

  it('shows the citation of an id the form already holds, and clears it on "Choose another"', async () => {
    const { fixture, loader, host } = setUp('3');
    await fixture.whenStable();
    backend
      .expectOne('/api/v1/sources/3')
      .flush({ ...codata, csl: {}, createdAt: '2026-01-01T00:00:00.000Z' });
    await until(() => fixture.nativeElement.textContent.includes('CODATA Key Values'), fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Choose another/ }))).click();
    expect(host.sourceId.value).toBeNull();
    expect(host.changes).toEqual([null]);
  });

  it('adds a new source through the dialog and chooses it', async () => {
    const { fixture, loader, root, host } = setUp();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add new source/ }))).click();
    await (
      await root.getHarness(MatInputHarness.with({ selector: 'mat-dialog-content input' }))
    ).setValue('10.5555/kestrel.demo.2025.001');
    await (await root.getHarness(MatButtonHarness.with({ text: 'Add source' }))).click();
    const added = {
      id: '57',
      citation: 'Nandakumar, P., & Brandt, H. (2025). Bomb calorimetry…',
      doi: '10.5555/kestrel.demo.2025.001',
    };
    backend
      .expectOne({ method: 'POST', url: '/api/v1/sources' })
      .flush(added, { status: 201, statusText: 'Created' });
    await until(() => host.sourceId.value === '57', fixture);
    expect(host.changes).toEqual([added]);
  });

  it('can be disabled by its form', async () => {
    const { fixture, loader, host } = setUp();
    host.sourceId.disable();
    await fixture.whenStable();
    expect(await (await loader.getHarness(MatAutocompleteHarness)).isDisabled()).toBe(true);
    expect(
      await (
        await loader.getHarness(MatButtonHarness.with({ text: /Add new source/ }))
      ).isDisabled(),
    ).toBe(true);
  });
});
