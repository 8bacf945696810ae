import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component, inject } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatTabGroupHarness } from '@angular/material/tabs/testing';
import { firstValueFrom } from 'rxjs';

import { errorInterceptor } from '../../core/error-interceptor';
import type { AddedSource } from '../sources-api';
import { AddSourceDialog } from './add-source-dialog';

@Component({ template: '' })
class Host {
  readonly dialog = inject(MatDialog);
}

// The first test compiles the dialog; a busy machine makes that slow, never wrong.
jest.setTimeout(30_000);

/** Waits for the view to show something (an answer settles a promise, then the view renders). */
async function until<T>(
  find: () => T | null | undefined,
  fixture: { whenStable(): Promise<unknown> },
): Promise<T> {
  for (;;) {
    await fixture.whenStable();
    const found = find();
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

const created = {
  id: '41',
  citation: 'Reyes, T. (2026). Plant trial notes (demo data).',
  doi: null,
};

describe('AddSourceDialog', () => {
  let backend: HttpTestingController;

  function open() {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(Host);
    const ref = fixture.componentInstance.dialog.open<AddSourceDialog, void, AddedSource>(
      AddSourceDialog,
    );
    const closed = firstValueFrom(ref.afterClosed());
    const loader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    return { fixture, loader, closed, ref };
  }

  afterEach(() => {
    backend.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((e) => (e.innerHTML = ''));
  });

  const input = (loader: ReturnType<typeof open>['loader'], selector: string) =>
    loader.getHarness(MatInputHarness.with({ selector }));
  const addButton = (loader: ReturnType<typeof open>['loader']) =>
    loader.getHarness(MatButtonHarness.with({ text: 'Add source' }));
  const tab = async (loader: ReturnType<typeof open>['loader'], label: string) =>
    (await loader.getHarness(MatTabGroupHarness)).selectTab({ label });

  it('looks a DOI up and closes with the new source', async () => {
    const { loader, closed } = open();
    await (await input(loader, 'input')).setValue(' 10.5555/kestrel.demo.2025.001 ');
    await (await addButton(loader)).click();
    const request = backend.expectOne({ method: 'POST', url: '/api/v1/sources' });
    expect(request.request.body).toEqual({ doi: '10.5555/kestrel.demo.2025.001' });
    request.flush(created, { status: 201, statusText: 'Created' });
    await expect(closed).resolves.toEqual({ source: created, existing: false });
  });

  it('says when the DOI was registered already (200) by closing with existing: true', async () => {
    const { loader, closed } = open();
    await (await input(loader, 'input')).setValue('10.5555/x');
    await (await addButton(loader)).click();
    backend.expectOne('/api/v1/sources').flush(created, { status: 200, statusText: 'OK' });
    await expect(closed).resolves.toEqual({ source: created, existing: true });
  });

  it('sends nothing while the open tab is empty', async () => {
    const { fixture, loader } = open();
    await (await addButton(loader)).click();
    backend.expectNone('/api/v1/sources');
    await until(() => document.body.textContent?.includes('Enter the DOI.'), fixture);
  });

  it('keeps the dialog open and shows the server’s message when a DOI is unknown', async () => {
    const { fixture, loader, ref } = open();
    await (await input(loader, 'input')).setValue('10.5555/nothing');
    await (await addButton(loader)).click();
    backend.expectOne('/api/v1/sources').flush(
      {
        error: {
          code: 'doi_not_found',
          message: 'No work is registered under the DOI 10.5555/nothing',
        },
      },
      { status: 422, statusText: 'Unprocessable' },
    );
    const alert = await until(() => document.querySelector('[role=alert]'), fixture);
    expect(alert.textContent).toContain('No work is registered under the DOI');
    expect(ref.getState()).toBe(0); // MatDialogState.OPEN
  });

  it('sends pasted BibTeX from the BibTeX tab', async () => {
    const { loader, closed } = open();
    await tab(loader, 'BibTeX');
    const bibtex = '@article{k, title={T}, author={Doe, Jane}, year={2020}}';
    await (await input(loader, 'textarea')).setValue(bibtex);
    await (await addButton(loader)).click();
    const request = backend.expectOne('/api/v1/sources');
    expect(request.request.body).toEqual({ bibtex });
    request.flush(created, { status: 201, statusText: 'Created' });
    await closed;
  });

  it('sends pasted RIS from the RIS tab', async () => {
    const { loader, closed } = open();
    await tab(loader, 'RIS');
    const ris = 'TY  - JOUR\nTI  - T\nER  - \n';
    await (await input(loader, 'textarea')).setValue(ris);
    await (await addButton(loader)).click();
    const request = backend.expectOne('/api/v1/sources');
    expect(request.request.body).toEqual({ ris });
    request.flush(created, { status: 201, statusText: 'Created' });
    await closed;
  });

  it('turns the fields typed by hand into CSL-JSON', async () => {
    const { loader, closed } = open();
    await tab(loader, 'By hand');
    await (
      await input(loader, '[formControlName=title]')
    ).setValue('Plant trial notes (demo data)');
    await (
      await input(loader, '[formControlName=authors]')
    ).setValue('Reyes, Tomas\nKestrel Process Works');
    await (await input(loader, '[formControlName=year]')).setValue('2026');
    await (await addButton(loader)).click();
    const request = backend.expectOne('/api/v1/sources');
    expect(request.request.body).toEqual({
      csl: {
        type: 'article-journal',
        title: 'Plant trial notes (demo data)',
        author: [{ family: 'Reyes', given: 'Tomas' }, { literal: 'Kestrel Process Works' }],
        issued: { 'date-parts': [[2026]] },
      },
    });
    request.flush(created, { status: 201, statusText: 'Created' });
    await expect(closed).resolves.toEqual({ source: created, existing: false });
  });
});
