import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { ProposalStatus } from '@contracts/proposals/proposals-schemas';
import { STATUS_WORDS } from './proposal-status';

/** A proposal's status in plain words; the word carries the meaning, the colour only helps. */
@Component({
  selector: 'thalpos-status-chip',
  template: `<span class="chip" [attr.data-status]="status()" [title]="words().means">{{
    words().label
  }}</span>`,
  styles: `
    .chip {
      display: inline-block;
      padding: 2px 10px;
      border-radius: 999px;
      font: var(--mat-sys-label-medium);
      white-space: nowrap;
      background: var(--mat-sys-surface-container-highest);
      color: var(--mat-sys-on-surface);
      border: 1px solid var(--mat-sys-outline-variant);
    }
    [data-status='submitted'] {
      background: var(--mat-sys-secondary-container);
      color: var(--mat-sys-on-secondary-container);
    }
    [data-status='changes_requested'] {
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    [data-status='approved'] {
      background: var(--mat-sys-primary-container);
      color: var(--mat-sys-on-primary-container);
    }
    [data-status='rejected'] {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StatusChip {
  readonly status = input.required<ProposalStatus>();
  protected readonly words = computed(() => STATUS_WORDS[this.status()]);
}
