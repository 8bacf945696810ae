import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatOption } from '@angular/material/core';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSelect } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { catchError, combineLatest, map, of, startWith, switchMap } from 'rxjs';

import type { ProposalList, ProposalStatus } from '@contracts/proposals/proposals-schemas';
import { readableMessage } from '../../../core/api-error';
import { CurationApi } from '../curation-api';
import { KIND_WORDS, STATUS_WORDS, STATUSES, when } from '../proposal-status';
import { StatusChip } from '../status-chip';

type Load =
  | { readonly state: 'loading' }
  | { readonly state: 'loaded'; readonly list: ProposalList }
  | { readonly state: 'failed'; readonly message: string };

/** The signed-in user's own proposals, newest change first, filtered by status. */
@Component({
  selector: 'thalpos-my-proposals',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormField,
    MatLabel,
    MatSelect,
    MatOption,
    MatButton,
    MatIcon,
    MatProgressBar,
    MatPaginator,
    StatusChip,
  ],
  templateUrl: './my-proposals.html',
  styleUrl: '../curation-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MyProposals {
  private readonly api = inject(CurationApi);

  protected readonly statuses = STATUSES;
  protected readonly statusWords = STATUS_WORDS;
  protected readonly kindWords = KIND_WORDS;
  protected readonly when = when;

  /** '' stands for every status. */
  protected readonly status = new FormControl<ProposalStatus | ''>('', { nonNullable: true });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(20);

  private readonly load = toSignal(
    combineLatest([
      this.status.valueChanges.pipe(startWith(this.status.value)),
      toObservable(this.pageIndex),
      toObservable(this.pageSize),
    ]).pipe(
      switchMap(([status, page, size]) =>
        this.api
          .list({
            status: status ? [status] : [],
            author: 'me',
            sort: 'updatedAt',
            order: 'desc',
            offset: page * size,
            limit: size,
          })
          .pipe(
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
  protected readonly list = computed(() => {
    const load = this.load();
    return load.state === 'loaded' ? load.list : null;
  });

  constructor() {
    this.status.valueChanges.subscribe(() => this.pageIndex.set(0));
  }

  protected turnPage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }

  protected kinds(kinds: readonly (keyof typeof KIND_WORDS)[]): string {
    return [...new Set(kinds)].map((k) => KIND_WORDS[k]).join(', ');
  }
}
