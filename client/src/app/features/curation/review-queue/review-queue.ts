import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatOption } from '@angular/material/core';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSelect } from '@angular/material/select';
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
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import type { ProposalList, ProposalStatus } from '@contracts/proposals/proposals-schemas';
import { readableMessage } from '../../../core/api-error';
import { CurationApi, type ProposalListRequest } from '../curation-api';
import { KIND_WORDS, STATUS_WORDS, when } from '../proposal-status';
import { StatusChip } from '../status-chip';

type Load =
  | { readonly state: 'loading' }
  | { readonly state: 'loaded'; readonly list: ProposalList }
  | { readonly state: 'failed'; readonly message: string };

/** Which proposals the queue shows; "open" is everything still waiting on someone. */
const QUEUE_FILTERS = [
  { value: 'submitted', label: STATUS_WORDS.submitted.label, statuses: ['submitted'] },
  {
    value: 'open',
    label: 'Open (waiting for review or for changes)',
    statuses: ['submitted', 'changes_requested'],
  },
  { value: 'approved', label: STATUS_WORDS.approved.label, statuses: ['approved'] },
  { value: 'rejected', label: STATUS_WORDS.rejected.label, statuses: ['rejected'] },
  { value: 'all', label: 'Every status except drafts', statuses: [] },
] as const satisfies readonly { value: string; label: string; statuses: ProposalStatus[] }[];
type QueueFilter = (typeof QUEUE_FILTERS)[number]['value'];

const SORTABLE = ['id', 'submittedAt', 'updatedAt', 'status'] as const;

/** Editors' review queue: what waits for a decision, oldest first; stale derived values flagged. */
@Component({
  selector: 'thalpos-review-queue',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormField,
    MatLabel,
    MatSelect,
    MatOption,
    MatCheckbox,
    MatIcon,
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
    StatusChip,
  ],
  templateUrl: './review-queue.html',
  styleUrls: ['../curation-page.scss', './review-queue.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewQueue {
  private readonly api = inject(CurationApi);

  protected readonly filters = QUEUE_FILTERS;
  protected readonly when = when;
  protected readonly columns = ['id', 'rationale', 'author', 'status', 'submittedAt', 'items'];

  protected readonly show = new FormControl<QueueFilter>('submitted', { nonNullable: true });
  protected readonly staleOnly = new FormControl(false, { nonNullable: true });

  protected readonly sort = signal<Sort>({ active: 'submittedAt', direction: 'asc' });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  private readonly showValue = toSignal(this.show.valueChanges, { initialValue: this.show.value });
  private readonly staleValue = toSignal(this.staleOnly.valueChanges, { initialValue: false });

  private readonly request = computed<ProposalListRequest>(() => {
    const sort = this.sort();
    const filter = QUEUE_FILTERS.find((f) => f.value === this.showValue()) ?? QUEUE_FILTERS[0];
    const statuses: ProposalStatus[] =
      filter.statuses.length > 0
        ? [...filter.statuses]
        : ['submitted', 'changes_requested', 'approved', 'rejected', 'withdrawn'];
    const active = (SORTABLE as readonly string[]).includes(sort.active)
      ? (sort.active as ProposalListRequest['sort'])
      : 'submittedAt';
    return {
      status: statuses,
      stale: this.staleValue() || undefined,
      sort: sort.direction === '' ? 'submittedAt' : active,
      order: sort.direction === 'desc' ? 'desc' : 'asc',
      offset: this.pageIndex() * this.pageSize(),
      limit: this.pageSize(),
    };
  });

  private readonly load = toSignal(
    toObservable(this.request).pipe(
      switchMap((request) =>
        this.api.list(request).pipe(
          map((list): Load => ({ state: 'loaded', list })),
          catchError((error: unknown) =>
            of<Load>({ state: 'failed', message: readableMessage(error) }),
          ),
          startWith<Load>({ state: 'loading' }),
        ),
      ),
    ),
    { initialValue: { state: 'loading' } as Load },
  );

  protected readonly loading = computed(() => this.load().state === 'loading');
  protected readonly failure = computed(() => {
    const load = this.load();
    return load.state === 'failed' ? load.message : null;
  });
  private readonly lastList = signal<ProposalList | null>(null);
  protected readonly rows = computed(() => {
    const load = this.load();
    const list = load.state === 'loaded' ? load.list : this.lastList();
    return (list?.proposals ?? []).map((p) => ({
      ...p,
      about: [
        [...new Set(p.kinds)].map((k) => KIND_WORDS[k]).join(', '),
        ...(p.species.length > 0 ? [p.species.join(', ')] : []),
      ].join(' · '),
    }));
  });
  protected readonly total = computed(() => {
    const load = this.load();
    return load.state === 'loaded' ? load.list.total : (this.lastList()?.total ?? 0);
  });

  constructor() {
    toObservable(this.load)
      .pipe(takeUntilDestroyed())
      .subscribe((load) => {
        if (load.state === 'loaded') this.lastList.set(load.list);
        if (load.state === 'failed') this.lastList.set(null);
      });
    this.show.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.pageIndex.set(0));
    this.staleOnly.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.pageIndex.set(0));
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
