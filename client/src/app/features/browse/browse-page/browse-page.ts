import { ChangeDetectionStrategy, Component, computed, effect, inject } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatHint, MatLabel, MatPrefix } from '@angular/material/form-field';
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
import { readableMessage } from '../../../core/api-error';
import { LATEST, ReleaseContext } from '../../../core/release-context';
import { ChemText } from '../../../shared/chem-text';
import { latestResponse } from '../../../shared/latest-response';
import { phoneWidth } from '../../../shared/phone-width';
import { phaseName } from '../../../shared/phase-name';
import { ReleasePicker } from '../../../shared/release-picker/release-picker';
import { TablePager } from '../../../shared/table-pager';
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

const COLUMNS = ['name', 'formula', 'phase', 'deltaFH', 'uncertainty', 'source'];
// On a phone, what fits its width: the name, the phase that tells rows apart, and the value. The
// formula and source are one tap away, on the species page.
const PHONE_COLUMNS = ['name', 'phase', 'deltaFH', 'uncertainty'];

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
  private readonly phone = phoneWidth();
  protected readonly columns = computed(() => (this.phone() ? PHONE_COLUMNS : COLUMNS));

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

  protected readonly pager = new TablePager({ sort: { active: 'name', direction: 'asc' } });
  private readonly phaseFilter = toSignal(this.phase.valueChanges, { initialValue: '' });

  private readonly request = computed<SpeciesTableRequest>(() => {
    const sort = this.pager.requestedSort();
    return {
      release: this.context.pinned(),
      page: this.pager.pageIndex() + 1,
      pageSize: this.pager.pageSize(),
      phase: this.phaseFilter() || null,
      sort: sort.active as SpeciesTableRequest['sort'],
      order: sort.direction,
    };
  });

  /** The last page that arrived stays on screen while the next one loads. */
  private readonly table = latestResponse({
    request: this.request,
    load: (request) => this.api.speciesPage(request),
  });
  private readonly lastPage = this.table.last;
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
  protected readonly loading = this.table.loading;
  protected readonly failure = this.table.failure;

  constructor() {
    // The picker pins the release in the URL; a link or Back changes the picker in turn.
    this.release.valueChanges
      .pipe(takeUntilDestroyed())
      .subscribe((version) => void this.context.pin(version));
    effect(() => {
      const pinned = this.context.pinned();
      if (this.release.value !== pinned) this.release.setValue(pinned, { emitEvent: false });
      this.pager.firstPage();
    });
    this.phase.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.pager.firstPage());
  }
}
