import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';

import { errorInterceptor } from '../../../core/error-interceptor';
import { SAFETY_CAUTION } from '../../../shared/safety-caution/safety-caution';
import type { HessSolution } from '../models/hess';
import { HessPage } from './hess-page';

const reformingSolution: HessSolution = {
  deltaH: 206.1,
  uncertainty: 0.5385,
  unit: 'kJ/mol',
  multipliers: [1, -1, -3, 0],
  unused: [3],
  steps: [
    { index: 0, multiplier: 1, flipped: false, scale: 1, deltaH: -802.3 },
    { index: 1, multiplier: -1, flipped: true, scale: 1, deltaH: 283 },
    { index: 2, multiplier: -3, flipped: true, scale: 3, deltaH: 725.4 },
    // The server reports every step; an unused one has multiplier 0.
    { index: 3, multiplier: 0, flipped: false, scale: 0, deltaH: 0 },
  ],
};

describe('HessPage', () => {
  let fixture: ComponentFixture<HessPage>;
  let backend: HttpTestingController;
  let loader: HarnessLoader;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [HessPage],
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(HessPage);
    element = fixture.nativeElement as HTMLElement;
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => {
    fixture.destroy();
    // Live equation checks are covered in equation-field.spec.ts.
    backend.match('/api/v1/equations/parse');
    backend.verify();
  });

  const field = (label: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[aria-label="${label}"]` }));
  const button = (name: string | RegExp) =>
    loader.getHarness(MatButtonHarness.with({ text: name }));
  const stepCount = () => element.querySelectorAll('li.step').length;

  async function calculate(): Promise<void> {
    await (await button(/Calculate/)).click();
  }

  it('shows the safety caution', () => {
    const caution = element.querySelector('thalpos-safety-caution');
    expect(caution?.getAttribute('role')).toBe('note');
    expect(caution?.textContent).toContain(SAFETY_CAUTION);
    expect(SAFETY_CAUTION).toBe(
      'Computed values are estimates from tabulated data. Hazard assessment of real processes needs measured data (e.g. reaction calorimetry) and review under local codes and licensed engineering practice.',
    );
  });

  it('comes filled with the reforming example in kJ/mol', async () => {
    expect(await (await field('Target equation')).getValue()).toBe(
      'CH4(g) + H2O(g) -> CO(g) + 3 H2(g)',
    );
    expect(stepCount()).toBe(4);
    expect(await (await field('Step 1 equation')).getValue()).toBe(
      'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
    );
    expect(await (await field('Step 1 ΔH')).getValue()).toBe('-802.3');
    expect(await (await field('Step 3 uncertainty')).getValue()).toBe('0.1');
    const unit = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="Unit"]' }),
    );
    expect(await unit.getValueText()).toBe('kJ/mol');
  });

  it('posts the steps to /api/v1/hess/solve and tabulates how each step is used, with the total', async () => {
    await calculate();

    const solve = backend.expectOne({ method: 'POST', url: '/api/v1/hess/solve' });
    expect(solve.request.body).toEqual({
      target: 'CH4(g) + H2O(g) -> CO(g) + 3 H2(g)',
      unit: 'kJ/mol',
      steps: [
        { equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', deltaH: -802.3, uncertainty: 0.4 },
        { equation: 'CO(g) + 1/2 O2(g) -> CO2(g)', deltaH: -283, uncertainty: 0.2 },
        { equation: 'H2(g) + 1/2 O2(g) -> H2O(g)', deltaH: -241.8, uncertainty: 0.1 },
        { equation: 'H2O(g) -> H2O(l)', deltaH: -44, uncertainty: 0.1 },
      ],
    });
    solve.flush(reformingSolution);
    await fixture.whenStable();

    const table = await loader.getHarness(
      MatTableHarness.with({ selector: '[aria-label="Steps as used"]' }),
    );
    expect(await (await table.getHeaderRows())[0].getCellTextByIndex()).toEqual([
      'Step',
      'Equation',
      'Flipped',
      'Scale',
      'ΔH (kJ/mol)',
    ]);
    expect(await table.getCellTextByIndex()).toEqual([
      ['1', 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', 'No', '×1', '-802.3'],
      ['2', 'CO(g) + 1/2 O2(g) -> CO2(g)', 'Yes', '×1', '283'],
      ['3', 'H2(g) + 1/2 O2(g) -> H2O(g)', 'Yes', '×3', '725.4'],
    ]);
    expect(await (await table.getFooterRows())[0].getCellTextByIndex()).toEqual([
      'Total',
      'CH4(g) + H2O(g) -> CO(g) + 3 H2(g)',
      '',
      '',
      '206.1 ± 0.54 kJ/mol',
    ]);
    expect(element.querySelector('.total-value')?.textContent).toBe('206.1 ± 0.54 kJ/mol');
    expect(element.querySelector('.unused h3')?.textContent).toBe('Not used');
    expect(
      Array.from(element.querySelectorAll('.unused li')).map((li) => li.textContent?.trim()),
    ).toEqual(['Step 4: H2O(g) -> H2O(l)']);
  });

  it('leaves out blank uncertainties, sends the chosen unit and shows a total without ±', async () => {
    await (await field('Step 1 uncertainty')).setValue('');
    const unit = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="Unit"]' }),
    );
    await unit.open();
    await unit.clickOptions({ text: 'kcal/mol' });
    expect(element.textContent).toContain('ΔH (kcal/mol)');

    await calculate();
    const solve = backend.expectOne('/api/v1/hess/solve');
    expect(solve.request.body.unit).toBe('kcal/mol');
    expect(solve.request.body.steps[0]).toEqual({
      equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
      deltaH: -802.3,
    });
    solve.flush({
      ...reformingSolution,
      deltaH: 49.26,
      uncertainty: null,
      unit: 'kcal/mol',
      unused: [],
    });
    await fixture.whenStable();

    expect(element.querySelector('.total-value')?.textContent).toBe('49.26 kcal/mol');
    expect(element.textContent).toContain('Every step was used.');
  });

  it('adds a step at the end and removes the chosen one, renumbering the rest', async () => {
    await (await button(/Add step/)).click();
    expect(stepCount()).toBe(5);
    expect(await (await field('Step 5 equation')).getValue()).toBe('');

    await (
      await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Remove step 2"]' }))
    ).click();
    expect(stepCount()).toBe(4);
    expect(await (await field('Step 2 equation')).getValue()).toBe('H2(g) + 1/2 O2(g) -> H2O(g)');
    expect(await (await field('Step 2 ΔH')).getValue()).toBe('-241.8');
  });

  it('keeps at least one step', async () => {
    await (await button('Clear')).click();
    expect(stepCount()).toBe(1);
    const remove = await loader.getHarness(
      MatButtonHarness.with({ selector: '[aria-label="Remove step 1"]' }),
    );
    expect(await remove.isDisabled()).toBe(true);

    await (await button('Load example')).click();
    expect(stepCount()).toBe(4);
  });

  it('does not post an incomplete form and says what is missing', async () => {
    await (await field('Target equation')).setValue('');
    await (await field('Step 2 ΔH')).setValue('');
    await calculate();

    backend.expectNone('/api/v1/hess/solve');
    expect(element.querySelector('.incomplete[role="alert"]')?.textContent).toContain(
      'Fill in the target equation and, for every step, its equation and ΔH.',
    );
    expect(element.textContent).toContain('Enter ΔH.');
  });

  it.each([
    [
      422,
      'no_combination',
      'The target contains CH3OH(g), which no step provides.',
      'These steps cannot be combined into the target equation.',
    ],
    [
      422,
      'not_unique',
      'Steps 2 and 4 are linear combinations of the others.',
      'These steps give the target in more than one way; remove the steps that repeat others.',
    ],
    [
      400,
      'parse_error',
      "Step 3: unknown element 'Xq' at position 0",
      'One of the equations cannot be read.',
    ],
  ])(
    'explains a %i %s in plain words with the server message',
    async (status, code, message, title) => {
      await calculate();
      backend
        .expectOne('/api/v1/hess/solve')
        .flush({ error: { code, message } }, { status, statusText: 'Refused' });
      await fixture.whenStable();

      const failure = element.querySelector('.failure[role="alert"]');
      expect(failure?.querySelector('.failure-title')?.textContent).toBe(title);
      expect(failure?.querySelector('.failure-message')?.textContent).toBe(message);
      expect(element.querySelector('[aria-label="Steps as used"]')).toBeNull();
    },
  );

  it('replaces an earlier result when a new calculation fails', async () => {
    await calculate();
    backend.expectOne('/api/v1/hess/solve').flush(reformingSolution);
    await fixture.whenStable();
    expect(element.querySelector('[aria-label="Steps as used"]')).not.toBeNull();

    await calculate();
    backend
      .expectOne('/api/v1/hess/solve')
      .flush(
        { error: { code: 'no_combination', message: 'No combination.' } },
        { status: 422, statusText: 'Unprocessable' },
      );
    await fixture.whenStable();
    expect(element.querySelector('[aria-label="Steps as used"]')).toBeNull();
    expect(element.querySelector('.failure-message')?.textContent).toBe('No combination.');
  });
});
