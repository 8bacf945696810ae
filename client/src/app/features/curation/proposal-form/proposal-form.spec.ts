import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component } from '@angular/core';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import type { FormArray, FormControl } from '@angular/forms';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter, Router } from '@angular/router';

import type { CheckAnswer } from '@contracts/proposals/proposals-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import type { ItemForm } from './item-form';
import { ProposalForm } from './proposal-form';

// The first test compiles Material components: slow on a busy machine, which must not fail it.
jest.setTimeout(60_000);

@Component({ template: '' })
class Blank {}

interface FormInternals {
  rationale: FormControl<string>;
  items: FormArray<ItemForm>;
}

/** Polls the view (answers settle promises and timers before the view renders). */
async function until<T>(find: () => T | null | undefined, fixture: ComponentFixture<unknown>) {
  for (;;) {
    await fixture.whenStable();
    const found = find();
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
}

describe('ProposalForm', () => {
  let backend: HttpTestingController;
  let fixture: ComponentFixture<ProposalForm>;
  let form: FormInternals;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: '**', component: Blank }]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ProposalForm);
    form = fixture.componentInstance as unknown as FormInternals;
    await fixture.whenStable();
  });

  afterEach(() => {
    // Species look-ups and live checks answer "nothing found"; they are not what is tested here.
    for (const r of backend.match((req) => req.url === '/api/v1/search')) {
      r.flush({ release: '2026.1', query: '', formula: null, results: [] });
    }
    for (const r of backend.match((req) => req.url.startsWith('/api/v1/sources/'))) {
      if (r.cancelled) continue;
      r.flush({ id: '12', citation: 'Demo source 12', doi: null, csl: {}, createdAt: '' });
    }
    for (const r of backend.match('/api/v1/proposals/check')) {
      r.flush({ ok: true, issues: [], warnings: [] });
    }
    backend.verify();
  });

  const text = () => fixture.nativeElement.textContent as string;
  const input = (label: string): HTMLInputElement =>
    fixture.nativeElement.querySelector(`[aria-label="${label}"]`);
  async function type(label: string, value: string) {
    const el = input(label);
    el.value = value;
    el.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  function fillValueItem(index = 0) {
    form.items.at(index).patchValue({
      kind: 'supersede_value',
      species: 'methane',
      phase: 'g',
      value: '-74.6',
      uncertainty: '0.3',
      method: 'combustion calorimetry',
      sourceId: '12',
    });
  }

  it('shows the value in J/mol as it is typed, minus and decimal comma read as elsewhere', async () => {
    await type('Item 1 value', '\u221274,6');
    expect(text()).toMatch(/Stored as −74600 J\/mol/);

    const loader = TestbedHarnessEnvironment.loader(fixture);
    const unit = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="Unit"]' }),
    );
    await unit.clickOptions({ text: 'kcal/mol' });
    await type('Item 1 value', '-17.88');
    expect(text()).toMatch(/Stored as −74809\.92 J\/mol/);

    await type('Item 1 value', '1,234');
    expect(text()).not.toMatch(/Stored as/);
    expect(text()).toMatch(/1,234 is ambiguous/);
  });

  it('adds items (carrying species and source over) and removes them', async () => {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    fillValueItem();
    expect(fixture.nativeElement.querySelector('[aria-label="Remove item 1"]')).toBeNull();

    await (await loader.getHarness(MatButtonHarness.with({ text: /Add another item/ }))).click();
    expect(fixture.nativeElement.querySelectorAll('fieldset.item')).toHaveLength(2);
    expect(form.items.at(1).getRawValue()).toMatchObject({
      kind: 'supersede_value',
      species: 'methane',
      sourceId: '12',
      value: '',
    });

    await (
      await loader.getHarness(
        MatButtonHarness.with({ text: /Remove/, selector: '[aria-label="Remove item 2"]' }),
      )
    ).click();
    expect(fixture.nativeElement.querySelectorAll('fieldset.item')).toHaveLength(1);
    expect(form.items.length).toBe(1);
  });

  it('asks only for the fields of the chosen kind and sends nothing until they are valid', async () => {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const kind = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="Item 1 kind"]' }),
    );
    await kind.clickOptions({ text: 'Add a species' });
    expect(text()).toMatch(/Formula/);
    expect(input('Item 1 value')).toBeNull();

    await (await loader.getHarness(MatButtonHarness.with({ text: /Save draft/ }))).click();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toMatch(
      /Some fields need attention/,
    );
    expect(text()).toMatch(/Say why: a rationale is required/);
    backend.expectNone((r) => r.method === 'POST' && r.url === '/api/v1/proposals');
  });

  it('shows the server’s live check in place: a likely duplicate and a formula the engine refuses', async () => {
    form.items.at(0).patchValue({
      kind: 'add_species',
      key: 'methane-2',
      name: 'Methane',
      formula: 'CH4x',
      phase: 'g',
    });
    const check = await until(() => backend.match('/api/v1/proposals/check')[0], fixture);
    expect(check.request.body.items[0]).toMatchObject({ kind: 'add_species', formula: 'CH4x' });
    const answer: CheckAnswer = {
      ok: false,
      issues: [
        {
          index: 0,
          path: 'items[0].formula',
          code: 'unknown_element',
          message: 'Unknown element X at character 4.',
        },
      ],
      warnings: [
        {
          index: 0,
          path: 'items[0]',
          code: 'likely_duplicate',
          message: 'A species with the same Hill formula and name exists: methane.',
          species: 'methane',
        },
      ],
    };
    check.flush(answer);
    await until(() => text().includes('Unknown element X'), fixture);
    expect(text()).toMatch(
      /Check: A species with the same Hill formula and name exists: methane\./,
    );
    expect(fixture.nativeElement.querySelector('a[href="/species/methane"]')).not.toBeNull();
  });

  it('saves a draft and then submits it, and opens the proposal', async () => {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    form.rationale.setValue('Newer combustion measurement (demo data).');
    fillValueItem();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Submit for review/ }))).click();

    const create = await until(
      () => backend.match((r) => r.method === 'POST' && r.url === '/api/v1/proposals')[0],
      fixture,
    );
    expect(create.request.body).toMatchObject({
      rationale: 'Newer combustion measurement (demo data).',
      items: [
        {
          kind: 'supersede_value',
          species: 'methane',
          value: -74.6,
          unit: 'kJ/mol',
          sourceId: '12',
        },
      ],
    });
    create.flush({ id: 41, status: 'draft', warnings: [] }, { status: 201, statusText: 'Created' });
    const submit = await until(() => backend.match('/api/v1/proposals/41/submit')[0], fixture);
    submit.flush({ id: 41, status: 'submitted', createdRevisionIds: [], warnings: [] });
    const router = TestBed.inject(Router);
    await until(() => router.url === '/curation/proposals/41', fixture);
  });

  it('shows the server’s refusal when saving fails, and keeps what was typed', async () => {
    const loader = TestbedHarnessEnvironment.loader(fixture);
    form.rationale.setValue('A value.');
    fillValueItem();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save draft/ }))).click();
    const create = await until(
      () => backend.match((r) => r.method === 'POST' && r.url === '/api/v1/proposals')[0],
      fixture,
    );
    create.flush(
      { error: { code: 'unknown_source', message: 'Source 12 does not exist.' } },
      { status: 422, statusText: 'Unprocessable' },
    );
    await until(() => text().includes('Source 12 does not exist.'), fixture);
    expect(form.items.at(0).getRawValue().value).toBe('-74.6');
  });
});
