import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { provideRouter, Router } from '@angular/router';

import type {
  DraftAnswer,
  DraftChange,
  StaleAnswer,
} from '@contracts/releases/release-drafts-schemas';
import { errorInterceptor } from '../../../../core/error-interceptor';
import { DraftPage } from './draft-page';

const source = { id: 7, citation: 'Kestrel demo re-evaluation (demo data)', doi: null };
const side = (revisionId: number, value: number, uncertainty: number | null) => ({
  revisionId,
  kind: 'formation_enthalpy' as const,
  value,
  valueText: String(value),
  uncertainty,
  uncertaintyBasis: uncertainty === null ? null : ('standard' as const),
  method: 'evaluated',
  temperature: null,
  heatCapacityForm: null,
  source,
});
const methane: DraftChange = {
  change: 'changed',
  revisionId: 501,
  included: true,
  species: { key: 'methane', name: 'Methane', formula: 'CH4' },
  phase: 'g',
  modification: null,
  quantity: 'formation_enthalpy',
  old: side(12, -74870, null),
  new: side(501, -74600, 300),
  difference: { kJPerMol: 0.27, combinedUncertainties: null },
};
const propane: DraftChange = {
  ...methane,
  change: 'added',
  revisionId: 502,
  species: { key: 'propane', name: 'Propane', formula: 'C3H8' },
  old: null,
  new: side(502, -104100, 500),
  difference: null,
};

function answer(changes: DraftChange[] = [methane, propane], stale = false): DraftAnswer {
  return {
    release: {
      version: '2026.3',
      status: 'draft',
      notes: 'First notes',
      base: '2026.2',
      stale,
      latest: stale ? '2026.4' : '2026.2',
      createdAt: '2026-12-01T10:00:00.000Z',
      createdBy: { login: 'demo-editor', name: 'Helga Brandt' },
    },
    counts: {
      added: changes.filter((c) => c.change === 'added').length,
      changed: changes.filter((c) => c.change === 'changed').length,
      retired: 0,
      included: changes.filter((c) => c.included).length,
      staleUnacknowledged: 0,
    },
    changes,
  };
}
const noStale: StaleAnswer = { release: '2026.3', stale: [] };

/** Waits until the condition holds (never for a fixed time). */
async function until<T>(probe: () => T | undefined | false): Promise<T> {
  for (;;) {
    const v = probe();
    if (v) return v;
    await new Promise((r) => setTimeout(r, 10));
  }
}

describe('DraftPage', () => {
  let fixture: ComponentFixture<DraftPage>;
  let backend: HttpTestingController;
  let loader: HarnessLoader;
  let rootLoader: HarnessLoader;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [DraftPage],
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(DraftPage);
    fixture.componentRef.setInput('version', '2026.3');
    loader = TestbedHarnessEnvironment.loader(fixture);
    rootLoader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  async function load(d = answer(), stale = noStale): Promise<void> {
    backend.expectOne('/api/v1/releases/2026.3/changes').flush(d);
    await fixture.whenStable();
    backend.expectOne('/api/v1/releases/2026.3/stale').flush(stale);
    await fixture.whenStable();
  }
  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';

  it('groups the changes with old, new and the difference', async () => {
    await load();
    expect(text()).toContain('Changed values (1)');
    expect(text()).toContain('Added values (1)');
    expect(text()).toContain('−74.87 kJ/mol');
    expect(text()).toContain('−74.6 ± 0.3 kJ/mol');
    expect(text()).toContain('+0.27 kJ/mol');
    expect(text()).not.toContain('Retired values');
  });

  it('leaves a change out with its include box', async () => {
    await load();
    let box: MatCheckboxHarness | undefined;
    for (const b of await loader.getAllHarnesses(MatCheckboxHarness)) {
      if ((await b.getAriaLabel())?.startsWith('Include Propane')) box = b;
    }
    if (!box) throw new Error('no include box for propane');
    await box.uncheck();
    const req = backend.expectOne({ method: 'PATCH', url: '/api/v1/releases/2026.3' });
    expect(req.request.body).toEqual({ exclude: [502] });
    req.flush(answer([methane, { ...propane, included: false }]));
    await fixture.whenStable();
    backend.expectOne('/api/v1/releases/2026.3/stale').flush(noStale);
    expect(await box.isChecked()).toBe(false);
  });

  it('acknowledges a stale derived value', async () => {
    const stale: StaleAnswer = {
      release: '2026.3',
      stale: [
        {
          revisionId: 900,
          species: { key: 'methanol', name: 'Methanol', formula: 'CH4O' },
          phase: 'l',
          modification: null,
          quantity: 'formation_enthalpy',
          value: -239100,
          acknowledged: false,
          inputs: [
            {
              revisionId: 12,
              speciesKey: 'methane',
              phase: 'g',
              modification: null,
              quantity: 'formation_enthalpy',
              replacedBy: 501,
            },
          ],
        },
      ],
    };
    await load(answer(), stale);
    expect(text()).toContain('Stale derived values (1)');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Acknowledge' }))).click();
    const req = backend.expectOne({
      method: 'POST',
      url: '/api/v1/releases/2026.3/acknowledgements',
    });
    expect(req.request.body).toEqual({ revisionIds: [900] });
    req.flush({ ...stale, stale: [{ ...stale.stale[0]!, acknowledged: true }] });
    await fixture.whenStable();
    expect(text()).toContain('Acknowledged');
  });

  it('publishes after confirming, showing the job’s progress, then opens the list', async () => {
    await load();
    const router = TestBed.inject(Router);
    const navigate = jest.spyOn(router, 'navigate').mockResolvedValue(true);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Publish 2026.3/ }))).click();
    const dialog = await rootLoader.getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Publish release 2026.3?');
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Publish' }))).click();
    // The dialog closes after its exit animation: wait for the request, not for a time.
    const publish = await until(
      () => backend.match({ method: 'POST', url: '/api/v1/releases/2026.3/publish' })[0],
    );
    const poll = await until(() => backend.match('/api/v1/releases/2026.3/publish-status')[0]);
    poll.flush({
      version: '2026.3',
      phase: 'pinning',
      percent: 45,
      message: 'Pinning one revision per species-phase and quantity',
      error: null,
      steps: [],
    });
    await fixture.whenStable();
    const bar = await loader.getHarness(MatProgressBarHarness);
    expect(await bar.getValue()).toBe(45);
    expect(text()).toContain('Pinning one revision per species-phase and quantity — 45%');

    publish.flush({ version: '2026.3' });
    await fixture.whenStable();
    backend.match('/api/v1/releases/2026.3/publish-status').forEach((r) => r.flush({}));
    expect(navigate).toHaveBeenCalledWith(['/releases']);
  });

  it('explains a stale draft and offers to move it onto the newest release', async () => {
    await load();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Publish 2026.3/ }))).click();
    const dialog = await rootLoader.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: 'Publish' }))).click();
    const publish = await until(
      () => backend.match({ method: 'POST', url: '/api/v1/releases/2026.3/publish' })[0],
    );
    publish.flush(
      {
        error: {
          code: 'stale_draft',
          message: 'stale',
          version: '2026.3',
          base: '2026.2',
          latest: '2026.4',
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    backend.match('/api/v1/releases/2026.3/publish-status').forEach((r) => r.flush({}));
    expect(text()).toContain(
      'Release 2026.4 was published after this draft was started from 2026.2.',
    );
    await (await loader.getHarness(MatButtonHarness.with({ text: /Move onto/ }))).click();
    const req = backend.expectOne({ method: 'PATCH', url: '/api/v1/releases/2026.3' });
    expect(req.request.body).toEqual({ rebase: true });
    req.flush(answer());
    await fixture.whenStable();
    backend.expectOne('/api/v1/releases/2026.3/stale').flush(noStale);
  });
});
