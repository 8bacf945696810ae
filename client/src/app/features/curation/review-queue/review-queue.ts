import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatOption } from '@angular/material/core';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatPaginator } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSelect } from '@angular/material/select';
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

import type { ProposalStatus } from '@contracts/proposals/proposals-schemas';
import { latestResponse } from '../../../shared/latest-response';
import { phoneWidth } from '../../../shared/phone-width';
import { TablePager } from '../../../shared/table-pager';
import { CurationApi, type ProposalListRequest } from '../curation-api';
import { KIND_WORDS, STATUS_WORDS, when } from '../proposal-status';
import { StatusChip } from '../status-chip';

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

const COLUMNS = ['id', 'rationale', 'author', 'status', 'submittedAt', 'items'];
const PHONE_COLUMNS = ['id', 'rationale', 'submittedAt'];

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
  private readonly phone = phoneWidth();
  // On a phone: number, proposal (with its out-of-date flag) and age; the filter says the status.
  protected readonly columns = computed(() => (this.phone() ? PHONE_COLUMNS : COLUMNS));

  protected readonly show = new FormControl<QueueFilter>('submitted', { nonNullable: true });
  protected readonly staleOnly = new FormControl(false, { nonNullable: true });

  protected readonly pager = new TablePager({ sort: { active: 'submittedAt', direction: 'asc' } });
  private readonly showValue = toSignal(this.show.valueChanges, { initialValue: this.show.value });
  private readonly staleValue = toSignal(this.staleOnly.valueChanges, { initialValue: false });

  private readonly request = computed<ProposalListRequest>(() => {
    const sort = this.pager.requestedSort();
    const filter = QUEUE_FILTERS.find((f) => f.value === this.showValue()) ?? QUEUE_FILTERS[0];
    const statuses: ProposalStatus[] =
      filter.statuses.length > 0
        ? [...filter.statuses]
        : ['submitted', 'changes_requested', 'approved', 'rejected', 'withdrawn'];
    return {
      status: statuses,
      stale: this.staleValue() || undefined,
      sort: (SORTABLE as readonly string[]).includes(sort.active)
        ? (sort.active as ProposalListRequest['sort'])
        : 'submittedAt',
      order: sort.direction,
      offset: this.pager.offset(),
      limit: this.pager.pageSize(),
    };
  });

  /** The last list that arrived stays on screen while the next one loads. */
  private readonly load = latestResponse({
    request: this.request,
    load: (request) => this.api.list(request),
  });
  protected readonly loading = this.load.loading;
  protected readonly failure = this.load.failure;
  protected readonly rows = computed(() =>
    (this.load.last()?.proposals ?? []).map((p) => ({
      ...p,
      about: [
        [...new Set(p.kinds)].map((k) => KIND_WORDS[k]).join(', '),
        ...(p.species.length > 0 ? [p.species.join(', ')] : []),
      ].join(' · '),
    })),
  );
  protected readonly total = computed(() => this.load.last()?.total ?? 0);

  constructor() {
    this.show.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.pager.firstPage());
    this.staleOnly.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.pager.firstPage());
  }
}
