import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import type { ReactionEnthalpyAnswer } from '@contracts/reactions/reactions-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import { SAFETY_CAUTION } from '../../../shared/safety-caution/safety-caution';
import { ReactionPage } from './reaction-page';

/** Kestrel Process Works' fuel-gas check: methane burnt to liquid water, release 2026.1. */
const combustion: ReactionEnthalpyAnswer = {
  release: '2026.1',
  equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
  temperatureK: 298.15,
  unit: 'kJ/mol',
  deltaH: -890.6,
  uncertainty: 0.42,
  uncertaintyBasis: 'standard',
  terms: [
    term({ species: 'methane', formula: 'CH4', coefficient: -1, deltaFH: -74.6, revisionId: '11' }),
    term({
      species: 'oxygen',
      formula: 'O2',
      coefficient: -2,
      deltaFH: 0,
      revisionId: null,
      source: null,
      referenceState: true,
      note: 'Element in its reference state: zero by definition.',
    }),
    term({ species: 'carbon-dioxide', formula: 'CO2', coefficient: 1, deltaFH: -393.51 }),
    term({ species: 'water', formula: 'H2O', phase: 'l', coefficient: 2, deltaFH: -285.83 }),
  ],
  assumptions: ['O2: phase g taken as the only phase this release holds.'],
  caution: 'Computed values are estimates.',
};

function term(
  overrides: Partial<ReactionEnthalpyAnswer['terms'][number]>,
): ReactionEnthalpyAnswer['terms'][number] {
  return {
    species: 'x',
    formula: 'X',
    phase: 'g',
    modification: null,
    coefficient: 1,
    deltaFH: 0,
    uncertainty: 0.1,
    uncertaintyBasis: 'standard',
    revisionId: '7',
    source: { citation: 'Kestrel data team, starter compilation (2026).', doi: '10.5555/kpw.1' },
    referenceState: false,
    note: null,
    standardPressure: '1 bar',
    ...overrides,
  };
}

const EQUATION = 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)';
const link = (params: Record<string, string>) =>
  `/calculate/reaction?${new URLSearchParams(params).toString()}`;

describe('ReactionPage', () => {
  let harness: RouterTestingHarness;
  let backend: HttpTestingController;
  let consoleError: jest.SpyInstance;

  beforeEach(async () => {
    // jsdom has no canvas: the curve's chart draws nothing and chart.js says so; keep it quiet.
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
    consoleError = jest.spyOn(console, 'error').mockImplementation(() => undefined);
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'calculate/reaction', component: ReactionPage },
          { path: 'species/:key', children: [] },
        ]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
  });

  afterEach(() => {
    // Live equation checks and the curve have specs of their own.
    backend.match('/api/v1/equations/parse');
    backend.match('/api/v1/reaction-enthalpy/batch');
    backend.verify();
    const unexpected = consoleError.mock.calls.filter(
      (args) => !String(args[0]).includes('Failed to create chart'),
    );
    expect(unexpected).toEqual([]);
    jest.restoreAllMocks();
  });

  const element = () => harness.routeNativeElement as HTMLElement;
  const text = (selector: string) =>
    element().querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
  const input = (label: string) =>
    element().querySelector<HTMLInputElement | HTMLTextAreaElement>(`[aria-label="${label}"]`)!;

  async function open(url: string): Promise<void> {
    await harness.navigateByUrl(url, ReactionPage);
    backend
      .match('/api/v1/releases')
      .forEach((r) => r.flush({ releases: [{ version: '2026.1', state: 'published' }] }));
    await harness.fixture.whenStable();
  }

  async function type(label: string, value: string): Promise<void> {
    const field = input(label);
    field.value = value;
    field.dispatchEvent(new Event('input'));
    await harness.fixture.whenStable();
  }

  function answerCalculation(answer: ReactionEnthalpyAnswer = combustion) {
    const request = backend.expectOne((r) => r.url === '/api/v1/reaction-enthalpy');
    request.flush(answer);
    return request;
  }

  it('carries the safety caution and starts at 298.15 K in kJ/mol with nothing computed', async () => {
    await open('/calculate/reaction');
    expect(element().querySelector('thalpos-safety-caution')?.textContent).toContain(
      SAFETY_CAUTION,
    );
    expect(input('Temperature in kelvin').value).toBe('298.15');
    expect(text('thalpos-unit-select')).toContain('kJ/mol');
    expect(element().querySelector('thalpos-reaction-result')).toBeNull();
    backend.expectNone('/api/v1/reaction-enthalpy');
  });

  it('computes what a link asks for, with every input the link names', async () => {
    await open(
      link({ equation: EQUATION, release: '2026.1', temperatureK: '298.15', unit: 'kJ/mol' }),
    );
    const request = answerCalculation();
    expect(request.request.method).toBe('GET');
    expect(request.request.params.get('equation')).toBe(EQUATION);
    expect(request.request.params.get('release')).toBe('2026.1');
    expect(request.request.params.get('temperatureK')).toBe('298.15');
    expect(request.request.params.get('unit')).toBe('kJ/mol');
    await harness.fixture.whenStable();

    expect(input('Equation').value).toBe(EQUATION);
    expect(text('.total-value')).toBe('−890.60 ± 0.42 kJ/mol');
    expect(text('.character')).toBe('exothermic');
    expect(text('.release')).toBe('2026.1');
    expect(text('.meta')).toContain('root sum of squares');
  });

  it('lists each term with its provenance: revision, citation, DOI and a link to the species', async () => {
    await open(link({ equation: EQUATION, release: '2026.1' }));
    answerCalculation();
    await harness.fixture.whenStable();

    const rows = Array.from(
      element().querySelectorAll('table[aria-label="Terms of the reaction"] tbody tr'),
    );
    expect(rows).toHaveLength(4);
    const methane = rows[0];
    expect(methane.textContent).toContain('CH₄');
    expect(methane.textContent).toContain('gas');
    expect(methane.textContent).toContain('Revision 11');
    expect(methane.textContent).toContain('Kestrel data team, starter compilation (2026).');
    expect(methane.querySelector('a.doi')?.getAttribute('href')).toBe(
      'https://doi.org/10.5555/kpw.1',
    );
    expect(methane.querySelector('a')?.getAttribute('href')).toBe(
      '/species/methane?release=2026.1',
    );
    // The reference element says why its value is zero instead of naming a revision.
    expect(rows[1].textContent).toContain('zero by definition');
    expect(rows[1].textContent).not.toContain('Revision');
    expect(rows[3].textContent).toContain('liquid');
    expect(text('.assumptions')).toContain('O2: phase g taken as the only phase');
  });

  it('puts the calculation in the URL when Calculate is pressed, pinning the newest release by name', async () => {
    await open('/calculate/reaction');
    await type('Equation', EQUATION);
    await type('Temperature in kelvin', '800');
    (element().querySelector('button.calculate') as HTMLButtonElement).click();
    await harness.fixture.whenStable();

    const url = new URL(TestBed.inject(Router).url, 'http://x');
    expect(Object.fromEntries(url.searchParams)).toEqual({
      equation: EQUATION,
      release: '2026.1',
      temperatureK: '800',
      unit: 'kJ/mol',
    });
    const request = answerCalculation({ ...combustion, temperatureK: 800 });
    expect(request.request.params.get('temperatureK')).toBe('800');
  });

  it('shows a result only while the inputs are the ones it was computed from', async () => {
    await open(link({ equation: EQUATION, release: '2026.1' }));
    answerCalculation();
    await harness.fixture.whenStable();
    expect(element().querySelector('thalpos-reaction-result')).not.toBeNull();

    await type('Temperature in kelvin', '500');
    expect(element().querySelector('thalpos-reaction-result')).toBeNull();
    expect(text('.out-of-date')).toContain('inputs have changed');

    await type('Temperature in kelvin', '298.15');
    expect(element().querySelector('thalpos-reaction-result')).not.toBeNull();
    expect(element().querySelector('.out-of-date')).toBeNull();
  });

  it('refuses a temperature it cannot read without asking the server', async () => {
    await open('/calculate/reaction');
    await type('Equation', EQUATION);
    await type('Temperature in kelvin', '-5');
    (element().querySelector('button.calculate') as HTMLButtonElement).click();
    await harness.fixture.whenStable();
    expect(text('thalpos-number-input mat-error')).toBe('Enter a temperature above 0 K.');
    backend.expectNone((r) => r.url === '/api/v1/reaction-enthalpy');
  });

  it('offers the balanced equation when the server refuses an unbalanced one', async () => {
    const unbalanced = 'CH4(g) + O2(g) -> CO2(g) + H2O(l)';
    await open(link({ equation: unbalanced, release: '2026.1' }));
    backend
      .expectOne((r) => r.url === '/api/v1/reaction-enthalpy')
      .flush(
        {
          error: {
            code: 'unbalanced',
            message: 'The equation is not balanced: O -2, H +0.',
            imbalance: { O: -2 },
            suggestion: EQUATION,
          },
        },
        { status: 422, statusText: 'Unprocessable Entity' },
      );
    await harness.fixture.whenStable();
    expect(text('.failure-title')).toBe('The equation is not balanced.');

    const use = Array.from(element().querySelectorAll('button')).find((b) =>
      b.textContent?.includes('Use this equation'),
    )!;
    use.click();
    await harness.fixture.whenStable();
    expect(input('Equation').value).toBe(EQUATION);
    // The refusal belonged to the old text: it gives way to the out-of-date note.
    expect(element().querySelector('.failure')).toBeNull();
  });

  it('answers a 429 with one calm message and the wait, not as a failed calculation', async () => {
    await open(link({ equation: EQUATION, release: '2026.1' }));
    backend
      .expectOne((r) => r.url === '/api/v1/reaction-enthalpy')
      .flush(
        { error: { code: 'rate_limited', message: 'Too many requests' } },
        { status: 429, statusText: 'Too Many Requests', headers: { 'Retry-After': '30' } },
      );
    await harness.fixture.whenStable();
    expect(text('.failure-title')).toBe('Please wait a moment.');
    expect(text('.failure-message')).toContain('Try again in 30 seconds');
    expect(element().querySelectorAll('.failure')).toHaveLength(1);
  });
});
