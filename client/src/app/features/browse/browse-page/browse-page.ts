import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  linkedSignal,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatHint, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
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
} from '@angular/material/table';
import { RouterLink } from '@angular/router';
import {
  catchError,
  combineLatest,
  debounceTime,
  distinctUntilChanged,
  map,
  of,
  startWith,
  switchMap,
} from 'rxjs';

import type { SearchAnswer } from '@contracts/search/search-schemas';
import type { ReleaseSpeciesPage } from '@contracts/species/species-schemas';
import { readableMessage } from '../../../core/api-error';
import { LATEST, ReleaseContext } from '../../../core/release-context';
import { ChemText } from '../../../shared/chem-text';
import { phaseName } from '../../../shared/phase-name';
import { ReleasePicker } from '../../../shared/release-picker/release-picker';
import { kjFromJoulesText, kjUncertainty } from '../../species/species-format';
import { BrowseApi, type SpeciesTableRequest } from '../browse-api';

/** Quiet time after the last keystroke before the search is asked. */
export const SEARCH_DEBOUNCE_MS = 250;

const PHASES = ['g', 'l', 'cr', 'am', 'aq'] as const;

type Search =
  | { readonly state: 'idle' }
  | { readonly state: 'searching'; readonly q: string }
  | { readonly state: 'found'; readonly q: string; readonly answer: SearchAnswer }
  | { readonly state: 'failed'; readonly q: string; readonly message: string };

type Table =
  | { readonly state: 'loading' }
  | { readonly state: 'loaded'; readonly page: ReleaseSpeciesPage }
  | { readonly state: 'failed'; readonly message: string };

/** Browse: search the registry as you type, and page through a release's species table. */
@Component({
  selector: 'thalpos-browse-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormField,
    MatLabel,
    MatHint,
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
    ReleasePicker,
  ],
  templateUrl: './browse-page.html',
  styleUrl: './browse-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BrowsePage {
  private readonly api = inject(BrowseApi);
  protected readonly context = inject(ReleaseContext);

  protected readonly phases = PHASES;
  protected readonly phaseName = phaseName;
  protected readonly columns = ['name', 'formula', 'phase', 'deltaFH', 'uncertainty', 'source'];

  protected readonly query = new FormControl('', { nonNullable: true });
  protected readonly release = new FormControl(this.context.pinned(), { nonNullable: true });
  /** '' stands for every phase (a select shows no label for null). */
  protected readonly phase = new FormControl('', { nonNullable: true });

  /** Results for the typed text in the pinned release; a new release searches again. */
  protected readonly search = toSignal(
    combineLatest([
      this.query.valueChanges.pipe(
        map((q) => q.trim()),
        debounceTime(SEARCH_DEBOUNCE_MS),
        distinctUntilChanged(),
      ),
      toObservable(this.context.pinned),
    ]).pipe(
      switchMap(([q, release]) =>
        q === ''
          ? of<Search>({ state: 'idle' })
          : this.api.search(q, release).pipe(
              map((answer): Search => ({ state: 'found', q, answer })),
              catchError((error: unknown) =>
                of<Search>({ state: 'failed', q, message: readableMessage(error) }),
              ),
              startWith<Search>({ state: 'searching', q }),
            ),
      ),
    ),
    { initialValue: { state: 'idle' } as Search },
  );

  protected readonly sort = signal<Sort>({ active: 'name', direction: 'asc' });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  private readonly phaseFilter = toSignal(this.phase.valueChanges, { initialValue: '' });

  private readonly request = computed<SpeciesTableRequest>(() => {
    const sort = this.sort();
    return {
      release: this.context.pinned(),
      page: this.pageIndex() + 1,
      pageSize: this.pageSize(),
      phase: this.phaseFilter() || null,
      sort: sort.direction === '' ? 'name' : (sort.active as SpeciesTableRequest['sort']),
      order: sort.direction === 'desc' ? 'desc' : 'asc',
    };
  });

  protected readonly table = toSignal(
    toObservable(this.request).pipe(
      switchMap((request) =>
        this.api.speciesPage(request).pipe(
          map((page): Table => ({ state: 'loaded', page })),
          catchError((error: unknown) =>
            of<Table>({ state: 'failed', message: readableMessage(error) }),
          ),
          startWith<Table>({ state: 'loading' }),
        ),
      ),
    ),
    { initialValue: { state: 'loading' } as Table },
  );

  /** The last page that arrived, kept on screen while the next one loads. */
  private readonly lastPage = linkedSignal<Table, ReleaseSpeciesPage | null>({
    source: this.table,
    computation: (table, previous) => {
      if (table.state === 'loaded') return table.page;
      return table.state === 'failed' ? null : (previous?.value ?? null);
    },
  });
  protected readonly rows = computed(() =>
    (this.lastPage()?.items ?? []).map((item) => ({
      ...item,
      phaseText: phaseName(item.phase, item.modification),
      kj: kjFromJoulesText(item.deltaFHText),
      spread: kjUncertainty(item.uncertainty),
    })),
  );
  /** The release the table shows, for its links (resolved: `latest` is never linked). */
  protected readonly lastRelease = computed(() => this.lastPage()?.release ?? null);
  protected readonly releaseParam = computed(() => {
    const pinned = this.context.pinned();
    return pinned === LATEST ? null : pinned;
  });
  protected readonly total = computed(() => this.lastPage()?.total ?? 0);
  protected readonly loading = computed(() => this.table().state === 'loading');
  protected readonly failure = computed(() => {
    const table = this.table();
    return table.state === 'failed' ? table.message : null;
  });

  constructor() {
    // The picker pins the release in the URL; a link or Back changes the picker in turn.
    this.release.valueChanges
      .pipe(takeUntilDestroyed())
      .subscribe((version) => void this.context.pin(version));
    effect(() => {
      const pinned = this.context.pinned();
      if (this.release.value !== pinned) this.release.setValue(pinned, { emitEvent: false });
      this.pageIndex.set(0);
    });
    this.phase.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.pageIndex.set(0));
  }

  protected sortBy(sort: Sort): void {
    this.sort.set(sort);
    this.pageIndex.set(0);
  }

  protected turnPage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }
}
