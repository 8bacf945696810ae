import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import type { SpeciesPage as SpeciesAnswer } from '@contracts/species/species-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import { STRUCTURE_DRAWER } from '../structure-picture/structure-picture';
import { SpeciesPage } from './species-page';

const citation = 'Kestrel data team, starter compilation (2026).';

function water(): SpeciesAnswer {
  const revision = {
    modification: null,
    valueText: null,
    uncertainty: null,
    uncertaintyBasis: null,
    temperature: null,
    toPhase: null,
    toModification: null,
    heatCapacity: null,
    method: null,
    standardPressure: '1 bar' as const,
    sourceId: 3,
    notes: null,
    fromMemory: false,
    status: 'accepted' as const,
    supersedesId: null,
    releases: [] as string[],
  };
  return {
    key: 'water',
    name: 'Water',
    synonyms: ['oxidane'],
    formula: 'H2O',
    charge: 0,
    casRn: '7732-18-5',
    inchi: 'InChI=1S/H2O/h1H2',
    inchiKey: 'XLYOFNOQVPJJNP-UHFFFAOYSA-N',
    smiles: 'O',
    notes: null,
    molarMass: 18.01528,
    phases: [
      {
        phase: 'l',
        modification: null,
        formationEnthalpy: [
          {
            release: '2026.1',
            publishedAt: '2026-11-30T10:00:00Z',
            revisionId: 12,
            value: -285830,
            uncertainty: 40,
            uncertaintyBasis: 'standard',
          },
        ],
      },
      { phase: 'g', modification: null, formationEnthalpy: [] },
    ],
    revisions: [
      {
        ...revision,
        id: 12,
        phase: 'l',
        kind: 'formation_enthalpy',
        quantity: 'formation_enthalpy',
        value: -285830,
        valueText: '-285830',
        uncertainty: 40,
        uncertaintyBasis: 'standard',
        method: 'combustion calorimetry',
        createdAt: '2026-11-29T09:00:00Z',
        supersedesId: 9,
        releases: ['2026.1'],
      },
      {
        ...revision,
        id: 30,
        phase: 'l',
        kind: 'transition',
        quantity: 'transition',
        value: 40650,
        valueText: '40650',
        temperature: 373.15,
        toPhase: 'g',
        createdAt: '2026-11-29T09:00:01Z',
      },
    ],
    sources: [{ id: 3, citation, doi: '10.5555/kpw.1', csl: {} }],
  };
}

describe('SpeciesPage', () => {
  let harness: RouterTestingHarness;
  let backend: HttpTestingController;
  const drawn: string[] = [];

  beforeEach(async () => {
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
    jest.spyOn(console, 'error').mockImplementation(() => undefined);
    TestBed.configureTestingModule({
      providers: [
        provideRouter(
          [
            { path: 'species/:key', component: SpeciesPage },
            { path: 'browse', children: [] },
          ],
          withComponentInputBinding(),
        ),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        {
          provide: STRUCTURE_DRAWER,
          useValue: (smiles: string) => {
            drawn.push(smiles);
            return Promise.resolve('<svg/>');
          },
        },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
  });

  afterEach(() => {
    backend.verify();
    jest.restoreAllMocks();
  });

  const element = () => harness.routeNativeElement as HTMLElement;
  const text = (selector: string) =>
    element().querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

  async function open(
    key: string,
    answer: (r: ReturnType<HttpTestingController['expectOne']>) => void,
  ) {
    await harness.navigateByUrl(`/species/${key}?release=2026.1`);
    backend.match('/api/v1/releases').forEach((r) =>
      r.flush({
        releases: [
          {
            version: '2026.1',
            status: 'published',
            notes: '',
            publishedAt: '2026-11-30T10:00:00Z',
            publishedBy: null,
          },
        ],
      }),
    );
    answer(backend.expectOne(`/api/v1/species/${key}`));
    await harness.fixture.whenStable();
    await new Promise((resolve) => setTimeout(resolve));
    await harness.fixture.whenStable();
  }

  it('shows identity, molar mass and a structure drawn from the SMILES', async () => {
    await open('water', (r) => r.flush(water()));
    expect(text('h1')).toBe('Water');
    expect(text('.formula')).toContain('H₂O');
    expect(text('.synonyms')).toBe('Also called oxidane.');
    expect(text('.molar-mass')).toBe('18.015 g/mol');
    expect(element().textContent).toContain('7732-18-5');
    expect(drawn).toContain('O');
    expect(element().querySelector('thalpos-structure-picture img')?.getAttribute('alt')).toBe(
      'Structure of Water (O)',
    );
  });

  it('lists each phase with its value in the pinned release, and says when a phase has none', async () => {
    await open('water', (r) => r.flush(water()));
    const phases = Array.from(element().querySelectorAll('.phase')).map((li) =>
      li.textContent?.replace(/\s+/g, ' ').trim(),
    );
    expect(phases[0]).toContain('H₂O(l)');
    expect(phases[0]).toContain('ΔfH° = −285.83 ± 0.04 kJ/mol');
    expect(phases[0]).toContain('revision #12');
    expect(phases[1]).toContain('Not in this release.');
  });

  it('tabulates ΔfH° per release beside the chart, and the revision history with its sources', async () => {
    await open('water', (r) => r.flush(water()));
    const cells = Array.from(
      element().querySelectorAll('table[aria-label="ΔfH° by release"] tbody tr'),
    ).map((tr) =>
      Array.from(tr.querySelectorAll('td')).map((td) =>
        td.textContent?.replace(/\s+/g, ' ').trim(),
      ),
    );
    expect(cells).toEqual([
      ['2026.1', 'H₂O(l) liquid', '−285.83', '0.04 standard uncertainty', '#12'],
    ]);
    expect(element().querySelector('thalpos-release-values canvas')).not.toBeNull();

    const history = Array.from(
      element().querySelectorAll('table[aria-label="Revision history"] tbody tr'),
    ).map((tr) => tr.textContent?.replace(/\s+/g, ' ').trim());
    // Newest first: the transition, then the ΔfH° that superseded revision 9.
    expect(history[0]).toContain('Phase transition');
    expect(history[0]).toContain('to gas at 373.15 K');
    expect(history[1]).toContain('supersedes #9');
    expect(history[1]).toContain('−285.83 ± 0.04 kJ/mol');
    expect(history[1]).toContain('in 2026.1');
    expect(history[1]).toContain(citation);
    expect(text('.sources')).toContain(citation);
    expect(element().querySelector('.sources a')?.getAttribute('href')).toBe(
      'https://doi.org/10.5555/kpw.1',
    );
  });

  it('labels the current value as derived and says in words when it is out of date', async () => {
    const answer = water();
    answer.revisions[0] = {
      ...answer.revisions[0],
      derived: true,
      stale: true,
      staleInputs: [{ inputRevisionId: 7, supersededBy: null, species: 'hydrogen', phase: 'g' }],
    };
    await open('water', (r) => r.flush(answer));
    const phase = text('.phase');
    expect(phase).toContain('Derived');
    expect(phase).toContain('Out of date: input #7 (hydrogen, g) was retired.');
  });

  it('says plainly when the key names no species', async () => {
    await open('watter', (r) =>
      r.flush(
        { error: { code: 'unknown_species', message: 'No species watter' } },
        { status: 404, statusText: 'Not Found' },
      ),
    );
    expect(text('.problem')).toContain('There is no species with the key watter');
  });
});
