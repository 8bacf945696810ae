import { Clipboard } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';

import { ChemText } from '../../../shared/chem-text';
import { type HessResultView, resultCsv, resultText } from '../hess-page/hess-outcome';

/**
 * The Hess result: ΔrH° at its temperature with its ± (or why there is none), each step as the
 * combination actually uses it, the unused steps, copy as text or CSV, and a link that
 * reproduces the calculation. Marked out of date as soon as the inputs change.
 */
@Component({
  selector: 'thalpos-hess-result',
  imports: [MatButton, MatIcon, ChemText],
  templateUrl: './hess-result.html',
  styleUrl: './hess-result.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '[class.stale]': 'stale()' },
})
export class HessResult {
  private readonly clipboard = inject(Clipboard);
  private readonly snackBar = inject(MatSnackBar);

  readonly view = input.required<HessResultView>();
  /** The inputs changed after this result was computed. */
  readonly stale = input(false);
  /** Absolute link that brings back the inputs this result was computed from. */
  readonly link = input.required<string>();

  protected readonly totalText = computed(() => {
    const { total, uncertainty, unit } = this.view();
    return `${total}${uncertainty === null ? '' : ` ± ${uncertainty}`} ${unit}`;
  });

  protected readonly signWord = computed(() => {
    const direction = this.view().direction;
    if (direction === 'exothermic') return 'Exothermic: heat is released';
    if (direction === 'endothermic') return 'Endothermic: heat is taken up';
    return 'Thermoneutral';
  });

  protected copyText(): void {
    this.copy(resultText(this.view(), this.link()), 'Result copied as text.');
  }

  protected copyCsv(): void {
    this.copy(resultCsv(this.view()), 'Result copied as CSV.');
  }

  private copy(text: string, done: string): void {
    const copied = this.clipboard.copy(text);
    this.snackBar.open(copied ? done : 'Copying was refused by the browser.', undefined, {
      duration: 3000,
    });
  }
}
