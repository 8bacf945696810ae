import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  viewChild,
} from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader } from '@angular/material/sort';
import {
  MatCell,
  MatCellDef,
  MatColumnDef,
  MatHeaderCell,
  MatHeaderCellDef,
  MatHeaderRow,
  MatHeaderRowDef,
  MatNoDataRow,
  MatRow,
  MatRowDef,
  MatTable,
  MatTableDataSource,
} from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import { map, startWith, switchMap } from 'rxjs';

import { ReleaseContext } from '../../../core/release-context';
import { ChemText } from '../../../shared/chem-text';
import { latestResponse } from '../../../shared/latest-response';
import { ReleasesApi } from '../releases-api';
import {
  diffSortValue,
  diffViewRow,
  matchesDiffFilter,
  type DiffFilter,
  type DiffViewRow,
} from './diff-rows';

/** Compare two releases: every value added, removed or changed, filterable and sortable. */
@Component({
  selector: 'thalpos-diff-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatFormField,
    MatLabel,
    MatPrefix,
    MatInput,
    MatIcon,
    MatSelect,
    MatOption,
    MatProgressBar,
    MatTable,
    MatColumnDef,
    MatHeaderCell,
    MatHeaderCellDef,
    MatCell,
    MatCellDef,
    MatHeaderRow,
    MatHeaderRowDef,
    MatRow,
    MatRowDef,
    MatNoDataRow,
    MatSort,
    MatSortHeader,
    MatPaginator,
    ChemText,
  ],
  templateUrl: './diff-page.html',
  styleUrl: './diff-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DiffPage {
  private readonly api = inject(ReleasesApi);
  private readonly router = inject(Router);
  protected readonly context = inject(ReleaseContext);

  /** From the route `/releases/:from/diff/:to`; absent on `/releases/diff`. */
  readonly from = input<string | undefined>();
  readonly to = input<string | undefined>();

  protected readonly columns = [
    'change',
    'species',
    'phase',
    'quantity',
    'old',
    'new',
    'difference',
    'sigmas',
    'sources',
  ];

  protected readonly fromControl = new FormControl('', { nonNullable: true });
  protected readonly toControl = new FormControl('', { nonNullable: true });
  protected readonly text = new FormControl('', { nonNullable: true });
  protected readonly change = new FormControl<DiffFilter['change']>('', { nonNullable: true });

  private readonly pair = computed(() => {
    const from = this.from();
    const to = this.to();
    return from && to ? { from, to } : null;
  });

  /** Idle until the URL names both releases. */
  protected readonly loaded = latestResponse({
    request: this.pair,
    load: (pair) => this.api.diff(pair.from, pair.to),
  }).state;

  /** A version from the URL that is not in the list, kept selectable as written. */
  protected readonly unlisted = computed(() => {
    const known = new Set(this.context.releases().map((r) => r.version));
    return [this.from(), this.to()].filter(
      (v, i, all): v is string => !!v && !known.has(v) && all.indexOf(v) === i,
    );
  });

  protected readonly diff = computed(() => {
    const loaded = this.loaded();
    return loaded.state === 'loaded' ? loaded.value : null;
  });
  protected readonly csvUrl = computed(() => {
    const pair = this.pair();
    return pair ? this.api.diffCsvUrl(pair.from, pair.to) : null;
  });

  protected readonly table = new MatTableDataSource<DiffViewRow>([]);
  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);
  private readonly filter = toSignal(
    this.text.valueChanges.pipe(
      startWith(''),
      switchMap((text) =>
        this.change.valueChanges.pipe(
          startWith(this.change.value),
          map((change): DiffFilter => ({ text, change })),
        ),
      ),
    ),
    { initialValue: { text: '', change: '' } as DiffFilter },
  );

  constructor() {
    this.table.sortingDataAccessor = diffSortValue;
    this.table.filterPredicate = (row, filter) =>
      matchesDiffFilter(row, JSON.parse(filter) as DiffFilter);
    effect(() => {
      this.table.data = (this.diff()?.rows ?? []).map(diffViewRow);
    });
    effect(() => {
      this.table.sort = this.sort() ?? null;
      this.table.paginator = this.paginator() ?? null;
    });
    effect(() => {
      this.table.filter = JSON.stringify(this.filter());
      this.table.paginator?.firstPage();
    });
    // The pickers follow the URL; with none in the URL, open on the newest two releases.
    effect(() => {
      const pair = this.pair();
      const releases = this.context.releases();
      if (pair) {
        this.fromControl.setValue(pair.from, { emitEvent: false });
        this.toControl.setValue(pair.to, { emitEvent: false });
      } else if (releases.length >= 2) {
        void this.show(releases[1]!.version, releases[0]!.version, true);
      }
    });
    this.fromControl.valueChanges
      .pipe(takeUntilDestroyed())
      .subscribe((from) => void this.show(from, this.toControl.value));
    this.toControl.valueChanges
      .pipe(takeUntilDestroyed())
      .subscribe((to) => void this.show(this.fromControl.value, to));
  }

  protected show(from: string, to: string, replaceUrl = false): Promise<boolean> {
    if (!from || !to) return Promise.resolve(false);
    return this.router.navigate(['/releases', from, 'diff', to], { replaceUrl });
  }

  protected swap(): void {
    void this.show(this.toControl.value, this.fromControl.value);
  }
}
