import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIcon } from '@angular/material/icon';

/** The caution every calculation screen carries. */
export const SAFETY_CAUTION =
  'Computed values are estimates from tabulated data. Hazard assessment of real processes needs ' +
  'measured data (e.g. reaction calorimetry) and review under local codes and licensed ' +
  'engineering practice.';

@Component({
  selector: 'thalpos-safety-caution',
  imports: [MatIcon],
  template: `
    <mat-icon aria-hidden="true">warning</mat-icon>
    <p><strong>Safety: </strong>{{ text }}</p>
  `,
  styles: `
    :host {
      display: flex;
      gap: 12px;
      align-items: flex-start;
      padding: 12px 16px;
      border-radius: var(--mat-sys-corner-medium);
      border-left: 4px solid var(--mat-sys-primary);
      background: var(--mat-sys-surface-container-high);
      color: var(--mat-sys-on-surface);
      font: var(--mat-sys-body-medium);
    }
    mat-icon {
      /* Never squashed by a long text beside it. */
      flex: none;
      color: var(--mat-sys-primary);
    }
    p {
      margin: 0;
      min-width: 0;
    }
  `,
  host: { role: 'note', 'aria-label': 'Safety caution' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SafetyCaution {
  protected readonly text = SAFETY_CAUTION;
}
