import { provideHttpClient, withInterceptors } from '@angular/common/http';
import {
  HttpTestingController,
  provideHttpClientTesting,
  type TestRequest,
} from '@angular/common/http/testing';
import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';

import type { AuditEntryView, AuditPage } from '@contracts/audit/audit-schemas';

import { errorInterceptor } from '../../../core/error-interceptor';
import { AuditLogPage } from './audit-page';

const entries: AuditEntryView[] = [
  {
    id: 42,
    at: '2026-03-03T12:00:00.000Z',
    actor: { id: 3, login: 'demo-editor', name: 'Helga Brandt' },
    action: 'proposal.decided',
    entityType: 'proposal',
    entityId: '12',
    before: { status: 'submitted' },
    after: { status: 'approved', comment: 'Agrees with the other measurements.' },
  },
  {
    id: 41,
    at: '2026-03-02T11:00:00.000Z',
    actor: null,
    action: 'registry.dataset_loaded',
    entityType: 'dataset',
    entityId: 'starter',
    before: null,
    after: { species: 120 },
  },
];

const page = (over: Partial<AuditPage> = {}): AuditPage => ({
  entries,
  page: 1,
  pageSize: 25,
  total: 60,
  scope: 'all',
  entityTypes: ['dataset', 'proposal', 'user'],
  ...over,
});

describe('AuditLogPage', () => {
  let fixture: ComponentFixture<AuditLogPage>;
  let backend: HttpTestingController;
  let loader: HarnessLoader;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [AuditLogPage],
      providers: [
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(AuditLogPage);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  });

  afterEach(() => backend.verify());

  const next = (): TestRequest =>
    backend.expectOne((r) => r.method === 'GET' && r.url === '/api/v1/audit');
  async function answer(body: AuditPage = page()): Promise<TestRequest> {
    const request = next();
    request.flush(body);
    await fixture.whenStable();
    return request;
  }
  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';
  const field = (control: string) =>
    loader.getHarness(MatInputHarness.with({ selector: `[formControlName="${control}"]` }));

  it('lists entries newest first with when, who, action and record', async () => {
    const first = await answer();
    expect(first.request.params.keys()).toEqual(['page', 'pageSize']);
    expect(first.request.params.get('page')).toBe('1');

    const table = await loader.getHarness(MatTableHarness);
    const cells = await table.getCellTextByColumnName();
    expect(cells['actor'].text).toEqual(['demo-editor', 'unknown']);
    expect(cells['action'].text).toEqual(['proposal.decided', 'registry.dataset_loaded']);
    expect(cells['entity'].text).toEqual(['proposal 12', 'dataset starter']);
    expect(text()).toContain('Every recorded change');
  });

  it('opens a row to show before and after side by side as formatted JSON', async () => {
    await answer();
    expect(text()).not.toContain('"approved"');
    const open = await loader.getHarness(
      MatButtonHarness.with({ selector: '[aria-label="Before and after of entry 42"]' }),
    );
    await open.click();
    const detail = (fixture.nativeElement as HTMLElement).querySelector('#audit-detail-42');
    const [before, after] = Array.from(detail!.querySelectorAll('pre')).map((p) => p.textContent);
    expect(before).toBe('{\n  "status": "submitted"\n}');
    expect(after).toBe(
      '{\n  "status": "approved",\n  "comment": "Agrees with the other measurements."\n}',
    );
    expect(await (await open.host()).getAttribute('aria-expanded')).toBe('true');

    await open.click();
    expect((fixture.nativeElement as HTMLElement).querySelector('#audit-detail-42')).toBeNull();
  });

  it('applies the filters on submit and goes back to the first page', async () => {
    await answer();
    const paginator = await loader.getHarness(MatPaginatorHarness);
    await paginator.goToNextPage();
    const second = await answer(page({ page: 2 }));
    expect(second.request.params.get('page')).toBe('2');

    await (await field('actor')).setValue('demo-editor');
    await (await field('action')).setValue('proposal.decided');
    const type = await loader.getHarness(MatSelectHarness);
    await type.open();
    await type.clickOptions({ text: 'proposal' });
    await (await field('entityId')).setValue('12');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Apply filters/ }))).click();

    const filtered = await answer();
    const params = filtered.request.params;
    expect(params.get('actor')).toBe('demo-editor');
    expect(params.get('action')).toBe('proposal.decided');
    expect(params.get('entityType')).toBe('proposal');
    expect(params.get('entityId')).toBe('12');
    expect(params.get('page')).toBe('1');
    expect(params.has('from')).toBe(false);

    await (await loader.getHarness(MatButtonHarness.with({ text: 'Clear' }))).click();
    expect((await answer()).request.params.keys()).toEqual(['page', 'pageSize']);
  });

  it('tells an editor the list covers curated data only', async () => {
    await answer(page({ scope: 'curated' }));
    expect(text()).toContain('Accounts and sign-ins are visible to admins only');
  });

  it('says why the log could not be loaded and tries again on request', async () => {
    next().flush(
      { error: { code: 'forbidden', message: 'This needs the editor role' } },
      { status: 403, statusText: 'Forbidden' },
    );
    await fixture.whenStable();
    expect(text()).toContain('Could not load the audit log: This needs the editor role');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    await answer(page({ entries: [], total: 0 }));
    expect(text()).toContain('No entries match these filters.');
  });
});
