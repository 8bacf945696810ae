import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatPaginatorHarness } from '@angular/material/paginator/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { MatTableHarness } from '@angular/material/table/testing';

import type { PreviewRow, UploadPreview as Preview } from '@contracts/uploads/uploads-schemas';
import { UploadPreview } from './upload-preview';

const cells = (species: string, phase = 'l', value = '-239.0') => ({
  species,
  phase,
  modification: null,
  value,
  unit: 'kJ/mol',
  uncertainty: '0.4',
  uncertainty_basis: 'standard',
  method: 'combustion_calorimetry',
  standard_pressure_pa: '100000',
  source: 'kpw-demo-bench-2026',
  from_memory: 'no',
  notes: 'demo data',
});

const clean = (n: number, species = 'methanol', kind = 'supersede_value'): PreviewRow => ({
  n,
  line: n + 1,
  layout: 'formation',
  cells: cells(species),
  itemIndex: n - 1,
  item: { kind, species, phase: 'l', quantity: 'formation_enthalpy' },
  errors: [],
});

const broken = (n: number): PreviewRow => ({
  n,
  line: n + 1,
  layout: 'formation',
  cells: cells('tolune', 'g', '50.3'),
  itemIndex: null,
  item: null,
  errors: [{ code: 'unknown_species', column: 'species', message: 'unknown species key tolune' }],
});

function preview(rows: PreviewRow[], fileErrors: Preview['fileErrors'] = []): Preview {
  const errorRowCount = rows.filter((r) => r.errors.length > 0).length;
  return {
    dryRun: true,
    ok: errorRowCount === 0 && fileErrors.length === 0,
    fileName: 'kpw-demo-formation.csv',
    format: 'csv',
    layouts: ['formation'],
    rationale: null,
    rowCount: rows.length,
    itemCount: rows.filter((r) => r.itemIndex !== null).length,
    errorRowCount,
    fileErrors,
    rows,
    warnings: [],
  };
}

describe('UploadPreview', () => {
  let fixture: ComponentFixture<UploadPreview>;
  let loader: HarnessLoader;

  async function show(p: Preview): Promise<void> {
    fixture = TestBed.createComponent(UploadPreview);
    fixture.componentRef.setInput('preview', p);
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
  }

  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';

  it('shows each row with what it becomes and says a clean file can be submitted', async () => {
    await show(preview([clean(1), clean(2, 'acetone', 'add_value')]));
    const table = await loader.getHarness(MatTableHarness);
    expect(await table.getCellTextByColumnName()).toEqual({
      line: { text: ['2', '3'], headerText: ['Line'], footerText: [] },
      type: { text: ['ΔfH°', 'ΔfH°'], headerText: ['Type'], footerText: [] },
      row: {
        text: ['methanol (l) -239.0 kJ/mol', 'acetone (l) -239.0 kJ/mol'],
        headerText: ['Row'],
        footerText: [],
      },
      action: {
        text: ['Replaces current value', 'New value'],
        headerText: ['Becomes'],
        footerText: [],
      },
      problems: { text: ['OK', 'OK'], headerText: ['Problems'], footerText: [] },
    });
    expect(text()).toContain('Every row is clean');
  });

  it('highlights a row with errors and names the column and the cause', async () => {
    await show(preview([clean(1), broken(2)]));
    const rows = (fixture.nativeElement as HTMLElement).querySelectorAll('tr.mat-mdc-row');
    expect([...rows].map((r) => r.classList.contains('has-error'))).toEqual([false, true]);
    expect(rows[1]!.textContent).toContain('species: unknown species key tolune');
    expect(rows[1]!.textContent).toContain('Not importable');
    expect(text()).toContain('1 row has errors');
  });

  it('lists problems of the whole file above the rows', async () => {
    await show(
      preview([clean(1)], [{ line: 1, column: 'method', message: 'missing column method' }]),
    );
    expect(text()).toContain('Line 1: missing column method');
    expect(text()).not.toContain('Every row is clean');
  });

  it('pages a long file and opens on its rows with errors, which can be toggled', async () => {
    const rows = Array.from({ length: 60 }, (_, i) => (i === 41 ? broken(i + 1) : clean(i + 1)));
    await show(preview(rows));
    const table = await loader.getHarness(MatTableHarness);
    expect((await table.getRows()).length).toBe(1);
    const toggle = await loader.getHarness(MatSlideToggleHarness);
    expect(await toggle.isChecked()).toBe(true);

    await toggle.toggle();
    expect((await table.getRows()).length).toBe(25);
    const paginator = await loader.getHarness(MatPaginatorHarness);
    expect(await paginator.getRangeLabel()).toBe('1 – 25 of 60');
    await paginator.goToNextPage();
    await paginator.goToNextPage();
    expect(await paginator.getRangeLabel()).toBe('51 – 60 of 60');
    expect((await table.getRows()).length).toBe(10);
  });
});
