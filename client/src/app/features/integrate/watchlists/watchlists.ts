import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  effect,
  inject,
  signal,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { filter, switchMap } from 'rxjs';

import type {
  ImpactAnswer,
  WatchlistSummary,
  WatchlistView,
} from '@contracts/watchlists/watchlists-schemas';
import { readableMessage } from '../../../core/api-error';
import { ReleaseContext } from '../../../core/release-context';
import { DEFAULT_ENERGY_UNIT, type EnergyUnit } from '../../../shared/energy-unit';
import { ReleasePicker } from '../../../shared/release-picker/release-picker';
import { UnitSelect } from '../../../shared/unit-select/unit-select';
import { EquationField } from '../../calculate/equation-field/equation-field';
import { ConfirmDialog, type ConfirmData } from '../confirm-dialog/confirm-dialog';
import { ImpactTable } from '../impact-table/impact-table';
import { IntegrateApi } from '../integrate-api';
import {
  reactionGroup,
  watchlistForm,
  watchlistRequest,
  type WatchlistForm,
} from './watchlist-form';

/**
 * Integrate → Watchlists: named sets of reactions, edited with the equation field, and an
 * impact report of a set between any two releases.
 */
@Component({
  selector: 'thalpos-watchlists',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatIconButton,
    MatFormField,
    MatLabel,
    MatError,
    MatInput,
    MatIcon,
    MatProgressBar,
    EquationField,
    ReleasePicker,
    UnitSelect,
    ImpactTable,
  ],
  templateUrl: './watchlists.html',
  styleUrl: './watchlists.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Watchlists {
  private readonly api = inject(IntegrateApi);
  private readonly releases = inject(ReleaseContext);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly lists = signal<readonly WatchlistSummary[]>([]);
  protected readonly loading = signal(true);
  protected readonly loadError = signal<string | null>(null);
  /** The watchlist being edited: null for a new one; undefined when none is open. */
  protected readonly editing = signal<WatchlistView | null | undefined>(undefined);
  protected readonly form = signal<WatchlistForm>(watchlistForm());
  protected readonly saving = signal(false);

  protected readonly from = new FormControl('', { nonNullable: true });
  protected readonly to = new FormControl('', { nonNullable: true });
  protected readonly unit = new FormControl<EnergyUnit>(DEFAULT_ENERGY_UNIT, { nonNullable: true });
  protected readonly report = signal<ImpactAnswer | null>(null);
  protected readonly running = signal(false);
  protected readonly runError = signal<string | null>(null);

  constructor() {
    this.load();
    // The two newest releases by default: what changed in the latest one.
    effect(() => {
      const [newest, previous] = this.releases.releases();
      if (newest && !this.to.value) this.to.setValue(newest.version);
      if (!this.from.value) this.from.setValue((previous ?? newest)?.version ?? '');
    });
  }

  protected load(): void {
    this.loading.set(true);
    this.loadError.set(null);
    this.api
      .listWatchlists()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (lists) => {
          this.lists.set(lists);
          this.loading.set(false);
        },
        error: (error: unknown) => {
          this.loadError.set(readableMessage(error));
          this.loading.set(false);
        },
      });
  }

  protected startNew(): void {
    this.report.set(null);
    this.form.set(watchlistForm());
    this.editing.set(null);
  }

  protected open(summary: WatchlistSummary): void {
    this.api
      .getWatchlist(summary.id)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (list) => {
          this.report.set(null);
          this.form.set(watchlistForm(list));
          this.editing.set(list);
        },
        error: (error: unknown) => this.notify(`Could not open it: ${readableMessage(error)}`),
      });
  }

  protected addReaction(): void {
    this.form().controls.reactions.push(reactionGroup());
  }

  protected removeReaction(index: number): void {
    this.form().controls.reactions.removeAt(index);
  }

  protected save(): void {
    const form = this.form();
    if (form.invalid || this.saving()) {
      form.markAllAsTouched();
      return;
    }
    const current = this.editing();
    this.saving.set(true);
    this.api
      .saveWatchlist(current?.id ?? null, watchlistRequest(form))
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (saved) => {
          this.saving.set(false);
          this.editing.set(saved);
          form.markAsPristine();
          this.notify(`Watchlist “${saved.name}” saved`);
          this.load();
        },
        error: (error: unknown) => {
          this.saving.set(false);
          this.notify(`Not saved: ${readableMessage(error)}`);
        },
      });
  }

  protected remove(): void {
    const current = this.editing();
    if (!current) return;
    this.dialog
      .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, {
        data: {
          title: `Delete “${current.name}”?`,
          message: 'Its reactions and the reports you would get for it are gone for good.',
          confirm: 'Delete',
        },
      })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => this.api.deleteWatchlist(current.id)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: () => {
          this.editing.set(undefined);
          this.report.set(null);
          this.notify(`Watchlist “${current.name}” deleted`);
          this.load();
        },
        error: (error: unknown) => this.notify(`Not deleted: ${readableMessage(error)}`),
      });
  }

  /** The impact report of the saved watchlist between the two picked releases. */
  protected run(): void {
    const current = this.editing();
    if (!current || this.running()) return;
    this.running.set(true);
    this.runError.set(null);
    this.api
      .impact(this.from.value, this.to.value, { watchlistId: current.id, unit: this.unit.value })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (report) => {
          this.running.set(false);
          this.report.set(report);
        },
        error: (error: unknown) => {
          this.running.set(false);
          this.runError.set(readableMessage(error));
        },
      });
  }

  private notify(message: string): void {
    this.snackBar.open(message, 'Dismiss', { duration: 6000 });
  }
}
