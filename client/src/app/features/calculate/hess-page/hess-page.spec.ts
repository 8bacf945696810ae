import { Clipboard } from '@angular/cdk/clipboard';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { HessAnswer, ParseAnswer } from '@contracts/calculate/calculate-schemas';

import { errorInterceptor } from '../../../core/error-interceptor';
import { SAFETY_CAUTION } from '../../../shared/safety-caution/safety-caution';
import { HessPage } from './hess-page';

/** What the server answers for the example (−802.29 kJ/mol; step 5 unused). */
const fuelGasAnswer: HessAnswer = {
  target: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
  deltaH: -802.29,
  uncertainty: null,
  unit: 'kJ/mol',
  multipliers: ['1', '1', '2', '2', '0'],
  unused: [4],
  alternativeSolutions: false,
  steps: [
    {
      index: 0,
      multiplier: '1',
      flipped: false,
      scale: '1',
      deltaH: -35.66,
      equation: 'CH4(g) + 1/2 O2(g) -> CO(g) + 2 H2(g)',
    },
    {
      index: 1,
      multiplier: '1',
      flipped: false,
      scale: '1',
      deltaH: -282.98,
      equation: 'CO(g) + 1/2 O2(g) -> CO2(g)',
    },
    {
      index: 2,
      multiplier: '2',
      flipped: false,
      scale: '2',
      deltaH: -571.66,
      equation: 'H2(g) + 1/2 O2(g) -> H2O(l)',
    },
    {
      index: 3,
      multiplier: '2',
      flipped: false,
      scale: '2',
      deltaH: 88,
      equation: 'H2O(l) -> H2O(g)',
    },
    {
      index: 4,
      multiplier: '0',
      flipped: false,
      scale: '0',
      deltaH: 0,
      equation: 'N2(g) + O2(g) -> 2 NO(g)',
    },
  ],
};

/** A parse answer for any equation: balanced, every term with a phase unless told otherwise. */
const parsedAs = (equation: string, phase: string | null = 'g') =>
  ({
    normalized: equation,
    balanced: true,
    imbalance: {},
    charge: '0',
    unknownComposition: [],
    suggestion: null,
    hints: [],
    species: [
      { formula: 'H2O', phase, phaseName: phase && 'gas', modification: null, coefficient: '1' },
    ],
  }) as ParseAnswer;

describe('HessPage', () => {
  let fixture: ComponentFixture<HessPage>;
  let backend: HttpTestingController;
  let loader: HarnessLoader;
  let element: HTMLElement;

  function configure(): void {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideRouter([{ path: 'calculate/hess', component: HessPage }]),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
  }

  beforeEach(async () => {
    configure();
    fixture = TestBed.createComponent(HessPage);
    element = fixture.nativeElement as HTMLElement;
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => {
    fixture?.destroy();
    backend.match('/api/v1/equations/parse');
    backend.verify();
  });

  const field = (label: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[aria-label="${label}"]` }));
  const button = (name: string | RegExp) =>
    loader.getHarness(MatButtonHarness.with({ text: name }));
  const text = (selector: string) =>
    element.querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim();

  /** Waits (for rendering, not for a fixed time) until `condition` holds. */
  async function until(condition: () => unknown): Promise<void> {
    for (let i = 0; i < 100 && !condition(); i++) {
      await new Promise((resolve) => setTimeout(resolve, 10));
      await fixture.whenStable();
    }
  }

  /** Answers every live check still waiting, as often as new ones come. */
  async function answerChecks(answer = (equation: string) => parsedAs(equation)): Promise<void> {
    for (let round = 0; round < 5; round++) {
      await fixture.whenStable();
      const pending = backend.match('/api/v1/equations/parse');
      if (pending.length === 0 && round > 0) break;
      for (const request of pending) request.flush(answer(request.request.body.equation));
    }
    await fixture.whenStable();
  }

  async function calculate(answer?: (equation: string) => ParseAnswer): Promise<void> {
    await (await button(/Calculate/)).click();
    await answerChecks(answer);
  }

  async function solved(answer: HessAnswer = fuelGasAnswer): Promise<void> {
    await calculate();
    backend.expectOne({ method: 'POST', url: '/api/v1/hess/solve' }).flush(answer);
    await fixture.whenStable();
  }

  it('shows the safety caution', () => {
    expect(element.querySelector('thalpos-safety-caution')?.textContent).toContain(SAFETY_CAUTION);
  });

  it('comes filled with the Kestrel fuel-gas check: five steps, one of them a phase change', async () => {
    expect(await (await field('Target equation')).getValue()).toBe(
      'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)',
    );
    expect(element.querySelectorAll('li.step').length).toBe(5);
    expect(await (await field('Step 4 equation')).getValue()).toBe('H2O(l) -> H2O(g)');
    expect(await (await field('Step 2 ΔH')).getValue()).toBe('-282.98');
    expect(text('.example-note')).toContain('Kestrel Process Works');
  });

  it('reads typed numbers with the shared parser: U+2212, en dash and a decimal comma keep sign and size', async () => {
    await (await field('Step 1 ΔH')).setValue('\u221235.66');
    await (await field('Step 2 ΔH')).setValue('\u2013282,98');
    await calculate();

    const solve = backend.expectOne('/api/v1/hess/solve');
    expect(solve.request.body.steps[0].deltaH).toBe(-35.66);
    expect(solve.request.body.steps[1].deltaH).toBe(-282.98);
    expect(solve.request.body.steps[1].uncertainty).toBe(0.21);
    expect(solve.request.body.steps[0].uncertainty).toBeUndefined();
    solve.flush(fuelGasAnswer);
  });

  it('refuses an ambiguous thousands separator with a message naming the step, and posts nothing', async () => {
    await (await field('Step 2 ΔH')).setValue('-282,980');
    await calculate();

    backend.expectNone('/api/v1/hess/solve');
    expect(text('.incomplete')).toContain('Step 2 ΔH: -282,980 is ambiguous');
  });

  it('refuses terms without a phase, naming the step and the term', async () => {
    await calculate((equation) => parsedAs(equation, equation.startsWith('H2O(l)') ? null : 'g'));
    backend.expectNone('/api/v1/hess/solve');
    await until(() => element.querySelector('.incomplete'));
    expect(text('.incomplete')).toContain('Step 4 equation: H2O needs a phase');
  });

  it('shows ΔrH° at its temperature, exothermic, each step as used, and why ± is missing', async () => {
    await solved();

    expect(text('.total')).toBe('ΔrH°(298.15 K) = \u2212802.29 kJ/mol');
    expect(text('.direction')).toBe('Exothermic: heat is released');
    expect(text('.uncertainty-note')).toBe('Uncertainty not combined: step 1 has none.');
    const rows = Array.from(element.querySelectorAll('table.used tbody tr')).map((tr) =>
      Array.from(tr.children).map((c) => c.textContent?.replace(/\s+/g, ' ').trim()),
    );
    expect(rows).toEqual([
      ['1', 'CH₄(g) + 1/2 O₂(g) → CO(g) + 2 H₂(g)', '\u221235.66'],
      ['2', 'CO(g) + 1/2 O₂(g) → CO₂(g)', '\u2212282.98'],
      ['3', '2 × (H₂(g) + 1/2 O₂(g) → H₂O(l))', '\u2212571.66'],
      ['4', '2 × (H₂O(l) → H₂O(g))', '88.00'],
    ]);
    expect(text('.unused li')).toBe('Step 5: N₂(g) + O₂(g) → 2 NO(g)');
  });

  it('writes a reversed, halved step as it is used, and states how ± was combined', async () => {
    await (await field('Step 1 uncertainty')).setValue('0.5');
    await (await field('Step 5 uncertainty')).setValue('0.1');
    await solved({
      ...fuelGasAnswer,
      deltaH: -283,
      uncertainty: 0.2,
      steps: fuelGasAnswer.steps.map((s, i) =>
        i === 1 ? { ...s, multiplier: '-1/2', flipped: true, scale: '1/2', deltaH: 141.49 } : s,
      ),
    });
    const row = element.querySelectorAll('table.used tbody tr')[1];
    expect(row.textContent?.replace(/\s+/g, ' ')).toContain('reversed');
    expect(row.querySelector('.equation')?.textContent?.trim()).toBe(
      '½ × (CO₂(g) → CO(g) + 1/2 O₂(g))',
    );
    expect(text('.uncertainty-note')).toContain(
      'root sum of squares of the independent step uncertainties',
    );
    expect(text('.total-value')).toBe('\u2212283.00 ± 0.20 kJ/mol');
  });

  it('keeps significant zeros: −283.0 stays −283.0', async () => {
    await (await field('Step 2 ΔH')).setValue('-283.0');
    await (await field('Step 1 ΔH')).setValue('-35.7');
    await (await field('Step 3 ΔH')).setValue('-285.8');
    await (await field('Step 4 ΔH')).setValue('44.0');
    await (await field('Step 5 ΔH')).setValue('180.5');
    await solved({
      ...fuelGasAnswer,
      deltaH: -802.4,
      steps: fuelGasAnswer.steps.map((s, i) => (i === 1 ? { ...s, deltaH: -283 } : s)),
    });
    expect(text('.total-value')).toBe('\u2212802.4 kJ/mol');
    expect(element.querySelectorAll('table.used tbody tr')[1].textContent).toContain('\u2212283.0');
  });

  it('marks the result out of date as soon as an input changes, and Clear removes it', async () => {
    await solved();
    expect(element.querySelector('.stale-note')).toBeNull();

    await (await field('Step 2 ΔH')).setValue('-283.5');
    await fixture.whenStable();
    expect(text('.stale-note')).toContain('Out of date');
    expect(element.querySelector('thalpos-hess-result')?.classList).toContain('stale');

    await (await field('Step 2 ΔH')).setValue('-282.98');
    await fixture.whenStable();
    expect(element.querySelector('.stale-note')).toBeNull();

    await (await button('Clear')).click();
    expect(element.querySelector('thalpos-hess-result')).toBeNull();
  });

  it('removes the result when a validation error stops the next calculation', async () => {
    await solved();
    await (await field('Step 2 ΔH')).setValue('abc');
    await calculate();
    expect(element.querySelector('thalpos-hess-result')).toBeNull();
    expect(text('.incomplete')).toContain('Step 2 ΔH');
  });

  it('names the step of a server parse error in the form numbering, with the position once and 1-based', async () => {
    await calculate();
    backend.expectOne('/api/v1/hess/solve').flush(
      {
        error: {
          code: 'parse_error',
          message: "expected '->' at position 7",
          field: 'steps[1].equation',
          position: 7,
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(text('.failure-title')).toBe('One of the equations cannot be read.');
    expect(text('.failure-message')).toBe("Step 2 equation: expected '->' (at character 8)");
  });

  it('answers a 429 with one calm notice and its wait time, not a failure', async () => {
    await calculate();
    backend
      .expectOne('/api/v1/hess/solve')
      .flush(
        { error: { code: 'rate_limited', message: 'Too many requests' } },
        { status: 429, statusText: 'Too Many Requests', headers: { 'Retry-After': '20' } },
      );
    await fixture.whenStable();
    expect(element.querySelectorAll('.limit-notice').length).toBe(1);
    expect(text('.limit-notice')).toContain('Try again in 20 seconds');
    expect(element.querySelector('.failure')).toBeNull();
  });

  it('copies the result as text and as CSV, and links to the calculation', async () => {
    const copy = jest.spyOn(TestBed.inject(Clipboard), 'copy').mockReturnValue(true);
    await solved();

    await (await button(/Copy as text/)).click();
    expect(copy.mock.calls[0][0]).toContain('ΔrH°(298.15 K) = \u2212802.29 kJ/mol (exothermic)');
    await (await button(/Copy as CSV/)).click();
    const csv = copy.mock.calls[1][0];
    expect(csv.split('\n')[0]).toBe(
      'step,used as,multiplier,step ΔH (kJ/mol),contribution (kJ/mol)',
    );
    expect(csv).toContain('3,2 × (H2(g) + 1/2 O2(g) -> H2O(l)),2,-285.83,-571.66');
    expect(csv).toContain('total,CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g),,,-802.29');

    const link = element.querySelector<HTMLAnchorElement>('a.permalink')!.href;
    const params = new URL(link).searchParams;
    expect(params.get('target')).toBe('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)');
    expect(params.getAll('step')[1]).toBe('CO(g) + 1/2 O2(g) -> CO2(g)|-282.98|0.21');
  });

  it('keeps the inputs in the URL as they are typed', async () => {
    await (await field('Target equation')).setValue('CO(g) + 1/2 O2(g) -> CO2(g)');
    const router = TestBed.inject(Router);
    await new Promise((resolve) => {
      const wait = () => (router.url.includes('target=CO') ? resolve(null) : setTimeout(wait, 20));
      wait();
    });
    expect(decodeURIComponent(router.url)).toContain('target=CO(g) + 1/2 O2(g) -> CO2(g)');
  });
});

describe('HessPage opened from a link', () => {
  it('fills the form from the URL and calculates at once', async () => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        provideRouter([{ path: 'calculate/hess', component: HessPage }]),
      ],
    });
    const backend = TestBed.inject(HttpTestingController);
    const harness = await RouterTestingHarness.create();
    const query = new URLSearchParams([
      ['target', 'H2O(l) -> H2O(g)'],
      ['step', 'H2O(l) -> H2O(g)|44.0|0.1'],
      ['unit', 'kJ/mol'],
      ['T', '298.15'],
    ]);
    await harness.navigateByUrl(`/calculate/hess?${query}`);
    const page = harness.routeNativeElement as HTMLElement;
    const input = page.querySelector<HTMLTextAreaElement>('[aria-label="Target equation"]');
    expect(input?.value).toBe('H2O(l) -> H2O(g)');
    expect(page.querySelectorAll('li.step').length).toBe(1);

    for (let round = 0; round < 3; round++) {
      await harness.fixture.whenStable();
      for (const r of backend.match('/api/v1/equations/parse'))
        r.flush(parsedAs(r.request.body.equation));
    }
    await harness.fixture.whenStable();
    const solve = backend.expectOne('/api/v1/hess/solve');
    expect(solve.request.body.steps).toEqual([
      { equation: 'H2O(l) -> H2O(g)', deltaH: 44, uncertainty: 0.1 },
    ]);
    solve.flush({ ...fuelGasAnswer, steps: [], unused: [], deltaH: 44 });
    harness.fixture.destroy();
  });
});
