import { ComponentFixture, TestBed } from '@angular/core/testing';

import { exampleReport as report } from './example-report';
import { ImpactTable } from './impact-table';

describe('ImpactTable', () => {
  let fixture: ComponentFixture<ImpactTable>;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [ImpactTable] });
    fixture = TestBed.createComponent(ImpactTable);
    fixture.componentRef.setInput('report', report);
    await fixture.whenStable();
  });

  const rows = () =>
    [...(fixture.nativeElement as HTMLElement).querySelectorAll('tbody tr')] as HTMLElement[];

  it('shows ΔrH in both releases and the change, with real minus signs', () => {
    const first = rows()[0]!.textContent ?? '';
    expect(first).toContain('Water formation');
    expect(first).toContain('H₂(g) + 1/2 O₂(g) → H₂O(l)');
    expect(first).toContain('−285.83');
    expect(first).toContain('−285.33');
    expect(first).toContain('0.5');
  });

  it('flags only the rows whose change exceeds the combined uncertainty', () => {
    expect(rows().map((r) => r.classList.contains('exceeds'))).toEqual([true, false, false]);
    expect(rows()[0]!.querySelector('[aria-label="exceeds the uncertainty"]')).not.toBeNull();
  });

  it("gives an item's error in place of its numbers and sums the report up", () => {
    expect(rows()[2]!.textContent).toContain('Xx is not an element');
    const summary = (fixture.nativeElement as HTMLElement).querySelector('.summary')!.textContent;
    expect(summary).toMatch(
      /3 reactions from 2026.1 to 2026.2: 1 changed by more than the combined\s+uncertainty; 1 could not be computed/,
    );
  });
});
