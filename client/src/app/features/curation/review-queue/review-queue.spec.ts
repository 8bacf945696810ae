import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { provideRouter } from '@angular/router';

import type { ProposalList, ProposalSummary } from '@contracts/proposals/proposals-schemas';
import { errorInterceptor } from '../../../core/error-interceptor';
import { ReviewQueue } from './review-queue';

const summary = (id: number, over: Partial<ProposalSummary> = {}): ProposalSummary => ({
  id,
  status: 'submitted',
  rationale: `Demo proposal ${id}`,
  author: { id: 2, login: 'demo-curator', name: 'Priya Nandakumar' },
  decidedBy: null,
  createdAt: '2026-11-30T09:00:00.000Z',
  updatedAt: '2026-11-30T09:00:00.000Z',
  submittedAt: '2026-11-30T09:05:00.000Z',
  decidedAt: null,
  itemCount: 1,
  kinds: ['supersede_value'],
  species: ['methane'],
  commentCount: 0,
  stale: false,
  ...over,
});

const list = (proposals: ProposalSummary[], total = proposals.length): ProposalList => ({
  proposals,
  total,
  offset: 0,
  limit: 25,
});

// The first test compiles Material components: slow on a busy machine, which must not fail it.
jest.setTimeout(60_000);

describe('ReviewQueue', () => {
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
    const fixture = TestBed.createComponent(ReviewQueue);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  afterEach(() => backend.verify());

  const nextRequest = async (fixture: { whenStable(): Promise<unknown> }) => {
    await fixture.whenStable();
    return backend.expectOne((r) => r.method === 'GET' && r.url === '/api/v1/proposals');
  };

  it('asks for submitted proposals, oldest first, and shows them with stale ones flagged', async () => {
    const { fixture, loader } = setUp();
    const first = await nextRequest(fixture);
    expect(first.request.params.toString()).toBe(
      'sort=submittedAt&order=asc&offset=0&limit=25&status=submitted',
    );
    first.flush(list([summary(3), summary(4, { stale: true, kinds: ['derive_value'] })]));
    await fixture.whenStable();

    const table = await loader.getHarness(MatTableHarness);
    const rows = await table.getRows();
    expect(rows).toHaveLength(2);
    const texts = await Promise.all(rows.map((r) => r.getCellTextByColumnName()));
    expect(texts[0]['id']).toBe('#3');
    expect(texts[0]['author']).toBe('Priya Nandakumar');
    expect(texts[0]['status']).toBe('Waiting for review');
    expect(texts[0]['rationale']).not.toMatch(/out of date/);
    expect(texts[1]['rationale']).toMatch(/derived value · methane/);
    expect(texts[1]['rationale']).toMatch(/Derived value out of date/);
  });

  it('sorts on the server and filters out-of-date derived values', async () => {
    const { fixture, loader } = setUp();
    (await nextRequest(fixture)).flush(list([summary(3)]));
    await fixture.whenStable();

    const sort = await loader.getHarness(MatSortHarness);
    const [idHeader] = await sort.getSortHeaders({ label: 'No.' });
    await idHeader.click();
    const sorted = await nextRequest(fixture);
    expect(sorted.request.params.get('sort')).toBe('id');
    expect(sorted.request.params.get('order')).toBe('asc');
    sorted.flush(list([summary(3)]));

    await (await loader.getHarness(MatCheckboxHarness)).check();
    const stale = await nextRequest(fixture);
    expect(stale.request.params.get('stale')).toBe('true');
    expect(stale.request.params.get('offset')).toBe('0');
    stale.flush(list([]));
    await fixture.whenStable();
    expect(fixture.nativeElement.textContent).toMatch(/Nothing waits for review with this filter/);
  });

  it('says so when the queue cannot be read', async () => {
    const { fixture } = setUp();
    (await nextRequest(fixture)).flush(
      { error: { code: 'forbidden', message: 'Editors and admins only.' } },
      { status: 403, statusText: 'Forbidden' },
    );
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toMatch(
      /The queue could not be loaded: Editors and admins only\./,
    );
  });
});
