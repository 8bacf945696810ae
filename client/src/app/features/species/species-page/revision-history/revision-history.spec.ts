import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';

import type { SpeciesPage } from '@contracts/species/species-schemas';
import { errorInterceptor } from '../../../../core/error-interceptor';
import { Session } from '../../../../core/session';
import { RevisionHistory } from './revision-history';

type Revision = SpeciesPage['revisions'][number];

const base: Revision = {
  id: 41,
  phase: 'g',
  modification: null,
  kind: 'formation_enthalpy',
  quantity: 'formation_enthalpy',
  value: -110530,
  valueText: '-110530',
  uncertainty: 170,
  uncertaintyBasis: 'standard',
  temperature: null,
  toPhase: null,
  toModification: null,
  heatCapacity: null,
  method: 'derived from a reaction enthalpy (demo data)',
  standardPressure: '1 bar',
  sourceId: 3,
  notes: null,
  fromMemory: false,
  status: 'accepted',
  supersedesId: null,
  createdAt: '2026-11-29T09:00:00Z',
  releases: [],
};

const staleDerived: Revision = {
  ...base,
  derived: true,
  stale: true,
  staleInputs: [{ inputRevisionId: 12, supersededBy: 57, species: 'carbon-dioxide', phase: 'g' }],
};

describe('RevisionHistory', () => {
  let fixture: ComponentFixture<RevisionHistory>;
  let backend: HttpTestingController;
  let role: string | null;

  async function render(revisions: Revision[]) {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        {
          provide: Session,
          useValue: { hasRole: (...roles: string[]) => role !== null && roles.includes(role) },
        },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(RevisionHistory);
    fixture.componentRef.setInput('revisions', revisions);
    fixture.componentRef.setInput('sources', [
      { id: 3, citation: 'Kestrel data team (demo data).', doi: null, csl: {} },
    ]);
    await fixture.whenStable();
  }

  const element = () => fixture.nativeElement as HTMLElement;
  const words = () => element().textContent?.replace(/\s+/g, ' ') ?? '';
  const button = () =>
    Array.from(element().querySelectorAll('button')).find((b) =>
      b.textContent?.includes('Re-derive'),
    );

  beforeEach(() => {
    role = 'curator';
    jest.spyOn(console, 'error').mockImplementation(() => undefined);
  });

  afterEach(() => {
    backend.verify();
    jest.restoreAllMocks();
  });

  it('labels a derived revision and says in words which input went out of date', async () => {
    await render([staleDerived]);
    expect(element().querySelector('.derived')?.textContent?.trim()).toBe('Derived');
    expect(element().querySelector('[role="note"]')?.textContent?.trim()).toBe(
      'Out of date: input #12 (carbon-dioxide, g) was superseded by revision #57.',
    );
  });

  it('shows neither label, notice nor button on a measured revision', async () => {
    await render([base]);
    expect(element().querySelector('.derived')).toBeNull();
    expect(words()).not.toContain('Out of date');
    expect(button()).toBeUndefined();
  });

  it.each([null, 'viewer'])('offers no Re-derive to %s', async (who) => {
    role = who;
    await render([staleDerived]);
    expect(words()).toContain('Out of date');
    expect(button()).toBeUndefined();
  });

  it('re-derives in one action and opens the new draft proposal', async () => {
    await render([staleDerived]);
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    button()!.click();
    const request = backend.expectOne('/api/v1/revisions/41/rederive');
    expect(request.request.method).toBe('POST');
    request.flush(
      { id: 88, status: 'draft', warnings: [] },
      { status: 201, statusText: 'Created' },
    );
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/curation/proposals', 88, 'edit']);
  });

  it("shows the server's message when re-deriving is refused", async () => {
    await render([staleDerived]);
    button()!.click();
    backend
      .expectOne('/api/v1/revisions/41/rederive')
      .flush(
        { error: { code: 'not_derived', message: 'Revision 41 has no recorded derivation' } },
        { status: 409, statusText: 'Conflict' },
      );
    await fixture.whenStable();
    expect(element().querySelector('[role="alert"]')?.textContent?.trim()).toBe(
      'Revision 41 has no recorded derivation',
    );
    expect(button()?.disabled).toBe(false);
  });
});
