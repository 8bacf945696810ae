import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
} from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { WatchlistImpactAnswer } from '@contracts/proposals/proposals-schemas';
import type { ImpactItem, ImpactSide } from '@contracts/watchlists/watchlists-schemas';
import { readableMessage } from '../../../core/api-error';
import { ChemText } from '../../../shared/chem-text';
import { formatValue } from '../../../shared/energy-unit';
import { CurationApi } from '../curation-api';

const signed = new Intl.NumberFormat('en-US', {
  maximumFractionDigits: 3,
  signDisplay: 'exceptZero',
  useGrouping: false,
});
const spread = new Intl.NumberFormat('en-US', { maximumSignificantDigits: 2, useGrouping: false });

/** A number with a real minus sign. */
const minus = (text: string) => text.replace('-', '−');

/** A reaction the proposal moves, or that only one side can compute. */
const affected = (r: ImpactItem) =>
  r.change !== null ? r.change !== 0 : 'error' in r.from !== 'error' in r.to;

/**
 * "Your watchlists": what approving the proposal would do to the reactions the signed-in reader
 * watches — ΔrH now and with the proposal, the change, and a flag in words where the change
 * exceeds the combined uncertainty. Only the reader's own watchlists are shown.
 */
@Component({
  selector: 'thalpos-watchlist-impact-panel',
  imports: [RouterLink, MatIcon, MatProgressBar, ChemText],
  templateUrl: './watchlist-impact-panel.html',
  styleUrl: './watchlist-impact-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WatchlistImpactPanel {
  private readonly api = inject(CurationApi);

  readonly proposalId = input.required<number>();

  protected readonly answer = signal<WatchlistImpactAnswer | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly loading = signal(false);

  /** Each watchlist with only the reactions the proposal touches. */
  protected readonly lists = computed(() =>
    (this.answer()?.watchlists ?? []).map((w) => ({
      id: w.id,
      name: w.name,
      count: w.report.count,
      rows: w.report.results.filter(affected),
    })),
  );

  constructor() {
    effect(() => void this.load(this.proposalId()));
  }

  private async load(id: number): Promise<void> {
    this.loading.set(true);
    try {
      this.answer.set(await firstValueFrom(this.api.watchlistImpact(id)));
      this.problem.set(null);
    } catch (error) {
      this.problem.set(readableMessage(error));
    } finally {
      this.loading.set(false);
    }
  }

  protected value(side: ImpactSide): string {
    return 'error' in side ? 'cannot be computed' : `${minus(formatValue(side.deltaH))} kJ/mol`;
  }

  protected errorOf(r: ImpactItem): string | null {
    const side = 'error' in r.to ? r.to : 'error' in r.from ? r.from : null;
    return side && 'error' in side ? side.error.message : null;
  }

  protected change(value: number): string {
    return `${minus(signed.format(value))} kJ/mol`;
  }

  protected spread(value: number): string {
    return spread.format(value);
  }

  protected equation(r: ImpactItem): string {
    return 'error' in r.from ? r.input : r.from.equation;
  }
}
