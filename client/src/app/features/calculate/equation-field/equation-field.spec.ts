import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { FormControl, Validators } from '@angular/forms';
import { MatInputHarness } from '@angular/material/input/testing';

import { errorInterceptor } from '../../../core/error-interceptor';
import { EQUATION_CHECK_DEBOUNCE_MS } from '../equation-check';
import type { ParseAnswer as ParsedEquation } from '@contracts/calculate/calculate-schemas';
import { EquationField } from './equation-field';

@Component({
  imports: [EquationField],
  template: `<thalpos-equation-field
    [control]="equation"
    label="Step 2 equation"
    [requirePhases]="requirePhases"
  />`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly equation = new FormControl('', { nonNullable: true, validators: Validators.required });
  requirePhases = false;
}

const pause = (ms = EQUATION_CHECK_DEBOUNCE_MS + 50) =>
  new Promise((resolve) => setTimeout(resolve, ms));

const parsed = (overrides: Partial<ParsedEquation>): ParsedEquation =>
  ({
    normalized: 'CO(g) + 1/2 O2(g) -> CO2(g)',
    balanced: true,
    imbalance: {},
    charge: '0',
    unknownComposition: [],
    suggestion: null,
    hints: [],
    species: [],
    ...overrides,
  }) as ParsedEquation;

describe('EquationField', () => {
  let fixture: ComponentFixture<Host>;
  let backend: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [Host],
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(Host);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const hint = () => (fixture.nativeElement as HTMLElement).querySelector('.check');
  const hintText = () => hint()?.textContent?.replace(/\s+/g, ' ').trim();

  async function typeAndAnswer(text: string, answer: ParsedEquation): Promise<void> {
    const input = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatInputHarness);
    await input.setValue(text);
    await pause();
    const request = backend.expectOne({ method: 'POST', url: '/api/v1/equations/parse' });
    expect(request.request.body).toEqual({ equation: text.trim() });
    request.flush(answer);
    await fixture.whenStable();
  }

  it('is labelled for assistive technology with its label', async () => {
    const input = await TestbedHarnessEnvironment.loader(fixture).getHarness(
      MatInputHarness.with({ selector: '[aria-label="Step 2 equation"]' }),
    );
    expect(await input.getValue()).toBe('');
    expect(hint()?.getAttribute('data-check')).toBe('empty');
  });

  it('shows a balanced equation as the server reads it', async () => {
    await typeAndAnswer(' CO(g) + 1/2 O2(g) -> CO2(g) ', parsed({}));

    expect(hint()?.getAttribute('data-check')).toBe('balanced');
    expect(hintText()).toContain('Balanced ✓ · read as CO(g) + 1/2 O₂(g) → CO₂(g)');
  });

  it('names each element that does not balance, and the suggestion', async () => {
    await typeAndAnswer(
      'CO(g) + O2(g) -> CO2(g)',
      parsed({
        normalized: 'CO(g) + O2(g) -> CO2(g)',
        balanced: false,
        imbalance: { C: '0', O: '-1' },
        suggestion: 'CO(g) + 1/2 O2(g) -> CO2(g)',
      }),
    );

    expect(hint()?.getAttribute('data-check')).toBe('unbalanced');
    expect(hintText()).toContain(
      'Not balanced: O -1 (products minus reactants). Suggestion: CO(g) + 1/2 O2(g) -> CO2(g)',
    );
  });

  it('mentions a charge that does not balance', async () => {
    await typeAndAnswer(
      'Fe^3+(aq) -> Fe^2+(aq)',
      parsed({
        normalized: 'Fe^3+(aq) -> Fe^2+(aq)',
        balanced: false,
        imbalance: {},
        charge: '-1',
      }),
    );
    expect(hintText()).toContain('Not balanced: charge -1');
  });

  it('shows a hint the server adds to its reading, e.g. for Fe2+', async () => {
    await typeAndAnswer('Fe2+(aq) -> Fe2+(aq)', {
      ...parsed({ normalized: 'Fe2+(aq) -> Fe2+(aq)' }),
      hints: ["'Fe2+' reads as Fe₂ with charge +1: did you mean 'Fe^2+'?"],
    } as ParsedEquation);
    expect(hintText()).toContain("did you mean 'Fe^2+'?");
  });

  it('says so when the balance of a registry-key term could not be counted', async () => {
    await typeAndAnswer(
      '[2-methylpropane](g) -> [butane](g)',
      parsed({ normalized: '[2-methylpropane](g) -> [butane](g)', balanced: null }),
    );
    expect(hint()?.getAttribute('data-check')).toBe('uncounted');
    expect(hintText()).toContain('Read as [2-methylpropane](g) → [butane](g); balance not checked');
  });

  it('shows where the server could not read the equation', async () => {
    const input = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatInputHarness);
    await input.setValue('CH4 + O2(g) -> CO2(g)');
    await pause();
    backend.expectOne('/api/v1/equations/parse').flush(
      {
        error: {
          code: 'parse_error',
          message: "expected '+' or an arrow at position 4",
          position: 4,
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();

    expect(hint()?.getAttribute('data-check')).toBe('invalid');
    // The position is stated once, 1-based, and the character is marked in the text.
    expect(hintText()).toContain("Cannot read this at character 5: expected '+' or an arrow");
    expect(hintText()?.match(/position|character/g)).toHaveLength(1);
    expect(hint()?.querySelector('mark')?.textContent).toBe('+');
    expect(hint()?.querySelector('.fault')?.textContent).toBe('CH4 + O2(g) -> CO2(g)');
  });

  it('shows an unknown element in the field, not as a network failure', async () => {
    const input = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatInputHarness);
    await input.setValue('Xy2(g) -> Xy2(l)');
    await pause();
    backend.expectOne('/api/v1/equations/parse').flush(
      {
        error: {
          code: 'unknown_element',
          message: "unknown element symbol 'Xy' at position 0",
          position: 0,
          symbol: 'Xy',
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(hint()?.getAttribute('data-check')).toBe('invalid');
    expect(hintText()).toContain("unknown element symbol 'Xy'");
    expect(hintText()).not.toContain('Could not check');
    expect(hint()?.textContent).not.toContain('cloud_off');
  });

  it('says phases are lower case without asking the server', async () => {
    const input = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatInputHarness);
    await input.setValue('H2O(L) -> H2O(g)');
    await pause();
    await fixture.whenStable();
    backend.expectNone('/api/v1/equations/parse');
    expect(hintText()).toContain('phases are written in lower case: (l), not (L)');
  });

  it('names the terms without a phase when phases are required', async () => {
    fixture.componentInstance.requirePhases = true;
    fixture.changeDetectorRef.markForCheck();
    await typeAndAnswer(
      'H2(g) + 1/2 O2(g) -> H2O',
      parsed({
        normalized: 'H2(g) + 1/2 O2(g) -> H2O',
        species: [
          { formula: 'H2', phase: 'g', modification: null, coefficient: '-1' },
          { formula: 'O2', phase: 'g', modification: null, coefficient: '-1/2' },
          { formula: 'H2O', phase: null, modification: null, coefficient: '1' },
        ] as ParsedEquation['species'],
      }),
    );
    expect(hint()?.getAttribute('data-check')).toBe('invalid');
    expect(hintText()).toContain('Every term needs its phase on this screen: H2O has none.');
    expect(hintText()).not.toContain('Balanced');
  });

  it('announces its hint only while the field is being edited', async () => {
    expect(hint()?.getAttribute('aria-live')).toBeNull();
    const textarea = (fixture.nativeElement as HTMLElement).querySelector('textarea')!;
    textarea.dispatchEvent(new Event('focus'));
    await fixture.whenStable();
    expect(hint()?.getAttribute('aria-live')).toBe('polite');
    textarea.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
    // (An empty required field shows its error instead of the hint once left.)
    expect(hint()?.getAttribute('aria-live') ?? null).toBeNull();
  });

  it('cancels a check still running when the text changes', async () => {
    const control = fixture.componentInstance.equation;
    control.setValue('H2(g) + O2(g) -> H2O(g)');
    await pause();
    const stale = backend.expectOne('/api/v1/equations/parse');
    await fixture.whenStable();
    expect(hintText()).toBe('Checking…');

    control.setValue('H2(g) + 1/2 O2(g) -> H2O(g)');
    await pause();
    expect(stale.cancelled).toBe(true);
    const fresh = backend.expectOne('/api/v1/equations/parse');
    expect(fresh.request.body).toEqual({ equation: 'H2(g) + 1/2 O2(g) -> H2O(g)' });
    fresh.flush(parsed({ normalized: 'H2(g) + 1/2 O2(g) -> H2O(g)' }));
    await fixture.whenStable();
    expect(hintText()).toContain('read as H₂(g) + 1/2 O₂(g) → H₂O(g)');
  });

  it('does not ask while the user is still typing', async () => {
    const control = fixture.componentInstance.equation;
    control.setValue('C(cr,graphite)');
    await pause(EQUATION_CHECK_DEBOUNCE_MS / 3);
    control.setValue('C(cr,graphite) + O2(g)');
    await pause(EQUATION_CHECK_DEBOUNCE_MS / 3);
    backend.expectNone('/api/v1/equations/parse');

    control.setValue('C(cr,graphite) + O2(g) -> CO2(g)');
    await pause();
    const requests = backend.match('/api/v1/equations/parse');
    expect(requests.map((r) => r.request.body)).toEqual([
      { equation: 'C(cr,graphite) + O2(g) -> CO2(g)' },
    ]);
    requests[0].flush(parsed({}));
  });
});
