import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { WatchlistImpactAnswer } from '@contracts/proposals/proposals-schemas';
import type { ImpactItem } from '@contracts/watchlists/watchlists-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import { WatchlistImpactPanel } from './watchlist-impact-panel';

@Component({
  imports: [WatchlistImpactPanel],
  template: `<thalpos-watchlist-impact-panel [proposalId]="7" />`,
})
class Host {}

/** Waits for the view to show something (an answer settles a promise, then the view renders). */
async function until<T>(
  find: () => T | null,
  fixture: { whenStable(): Promise<unknown> },
): Promise<T> {
  for (;;) {
    await fixture.whenStable();
    const found = find();
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 10));
  }
}

jest.setTimeout(60_000);

const side = (deltaH: number, equation = 'x') => ({
  equation,
  deltaH,
  uncertainty: 0.04,
  uncertaintyBasis: 'as_stated',
});

function item(over: Partial<ImpactItem>): ImpactItem {
  return {
    index: 0,
    label: null,
    input: 'x',
    temperatureK: 298.15,
    from: side(-285.83),
    to: side(-284.83),
    change: 1,
    combinedUncertainty: 0.057,
    exceedsUncertainty: true,
    ...over,
  };
}

function answer(watchlists: WatchlistImpactAnswer['watchlists']): WatchlistImpactAnswer {
  return { proposalId: 7, status: 'submitted', watchlists, caution: 'Use with care.' };
}

function report(results: ImpactItem[]) {
  return {
    from: 'accepted',
    to: 'proposal-7',
    unit: 'kJ/mol' as const,
    watchlistId: 3,
    count: results.length,
    errors: 0,
    exceeding: 1,
    results,
    caution: 'Use with care.',
  };
}

describe('WatchlistImpactPanel', () => {
  let backend: HttpTestingController;

  function setUp() {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(Host);
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  afterEach(() => backend.verify());

  it('lists only the reactions the proposal moves, with before, after, change and a flag in words', async () => {
    const { fixture, el } = setUp();
    await fixture.whenStable();
    backend.expectOne('/api/v1/proposals/7/watchlist-impact').flush(
      answer([
        {
          id: 3,
          name: 'Burner duties',
          affected: 2,
          report: report([
            item({
              index: 0,
              label: 'water formation',
              from: side(-285.83, 'H2(g) + 1/2 O2(g) -> H2O(l)'),
            }),
            item({
              index: 1,
              from: side(-393.51, 'C(graphite) + O2(g) -> CO2(g)'),
              to: side(-393.51),
              change: 0,
              exceedsUncertainty: false,
            }),
            item({
              index: 2,
              temperatureK: 500,
              from: side(-800.0, 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)'),
              to: side(-801.2),
              change: -1.2,
              combinedUncertainty: 3,
              exceedsUncertainty: false,
            }),
          ]),
        },
      ]),
    );
    const rows = await until(() => {
      const found = el.querySelectorAll('li');
      return found.length ? found : null;
    }, fixture);
    // The unchanged CO2 reaction is left out.
    expect(rows.length).toBe(2);
    const first = rows[0]!.textContent!;
    expect(first).toContain('water formation');
    expect(first).toContain('−285.83 kJ/mol');
    expect(first).toContain('−284.83 kJ/mol');
    expect(first).toContain('+1 kJ/mol');
    expect(first).toContain('at 298.15 K');
    expect(first).toContain('larger than the combined uncertainty (±0.057');
    const second = rows[1]!.textContent!;
    expect(second).toContain('−1.2 kJ/mol');
    expect(second).toContain('at 500 K');
    expect(second).toContain('Within the combined uncertainty (±3 kJ/mol)');
    expect(second).not.toContain('larger than');
    expect(el.querySelector('h3')!.textContent).toContain('Burner duties');
    expect(el.textContent).toContain('Use with care.');
  });

  it('says so when no reaction of a watchlist changes', async () => {
    const { fixture, el } = setUp();
    await fixture.whenStable();
    backend.expectOne('/api/v1/proposals/7/watchlist-impact').flush(
      answer([
        {
          id: 4,
          name: 'Steam',
          affected: 0,
          report: report([item({ change: 0, to: side(-285.83), exceedsUncertainty: false })]),
        },
      ]),
    );
    const note = await until(() => el.querySelector('.unchanged'), fixture);
    expect(note.textContent).toContain('None of its 1 reaction changes');
    expect(el.querySelector('li')).toBeNull();
  });

  it('links to Integrate when the reader has no watchlists', async () => {
    const { fixture, el } = setUp();
    await fixture.whenStable();
    backend.expectOne('/api/v1/proposals/7/watchlist-impact').flush(answer([]));
    const link = await until(() => el.querySelector<HTMLAnchorElement>('.empty a'), fixture);
    expect(link.getAttribute('href')).toBe('/integrate');
    expect(el.textContent).toContain('You have no watchlists yet');
  });

  it('shows the server’s reason when the check fails', async () => {
    const { fixture, el } = setUp();
    await fixture.whenStable();
    backend
      .expectOne('/api/v1/proposals/7/watchlist-impact')
      .flush(
        { error: { code: 'forbidden', message: 'You may not do this' } },
        { status: 403, statusText: 'Forbidden' },
      );
    const problem = await until(() => el.querySelector('.problem'), fixture);
    expect(problem.textContent).toContain('could not be checked');
  });
});
