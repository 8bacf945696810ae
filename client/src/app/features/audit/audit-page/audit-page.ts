import { DatePipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  linkedSignal,
  signal,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import {
  MatCell,
  MatCellDef,
  MatColumnDef,
  MatHeaderCell,
  MatHeaderCellDef,
  MatHeaderRow,
  MatHeaderRowDef,
  MatRow,
  MatRowDef,
  MatTable,
} from '@angular/material/table';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import type { AuditEntryView, AuditPage } from '@contracts/audit/audit-schemas';

import { readableMessage } from '../../../core/api-error';
import { AuditApi } from '../audit-api';
import { auditRequest, formatState, type AuditFilterValue } from './audit-filter';

type Outcome =
  { state: 'loading' } | { state: 'ok'; page: AuditPage } | { state: 'error'; message: string };

const EMPTY_FILTER: AuditFilterValue = {
  actor: '',
  action: '',
  entityType: '',
  entityId: '',
  fromDay: '',
  toDay: '',
};

/**
 * Audit log: who changed what and when, newest first, filtered by who, action, entity and days;
 * a row opens to show the record before and after the change side by side. Admins see every
 * entry, editors the curated data only (the server decides; the page says which).
 */
@Component({
  selector: 'thalpos-audit-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatButton,
    MatIconButton,
    MatFormField,
    MatLabel,
    MatHint,
    MatInput,
    MatIcon,
    MatSelect,
    MatOption,
    MatPaginator,
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
  ],
  templateUrl: './audit-page.html',
  styleUrl: './audit-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditLogPage {
  private readonly api = inject(AuditApi);

  protected readonly columns = ['at', 'actor', 'action', 'entity', 'expand'] as const;
  protected readonly detailColumns = ['detail'] as const;
  protected readonly pageSizes = [25, 50, 100] as const;
  protected readonly formatState = formatState;

  protected readonly filters = new FormGroup({
    actor: new FormControl('', { nonNullable: true }),
    action: new FormControl('', { nonNullable: true }),
    entityType: new FormControl('', { nonNullable: true }),
    entityId: new FormControl('', { nonNullable: true }),
    fromDay: new FormControl('', { nonNullable: true }),
    toDay: new FormControl('', { nonNullable: true }),
  });

  /** The filters last applied (the form applies on submit, not on every key). */
  private readonly applied = signal<AuditFilterValue>(EMPTY_FILTER);
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(25);
  private readonly reloads = signal(0);
  protected readonly expanded = signal<number | null>(null);

  private readonly request = computed(() => {
    this.reloads();
    return auditRequest(this.applied(), this.pageIndex(), this.pageSize());
  });

  protected readonly outcome = toSignal(
    toObservable(this.request).pipe(
      switchMap((request) =>
        this.api.list(request).pipe(
          map((page): Outcome => ({ state: 'ok', page })),
          catchError((error: unknown) =>
            of<Outcome>({ state: 'error', message: readableMessage(error) }),
          ),
          startWith<Outcome>({ state: 'loading' }),
        ),
      ),
    ),
    { initialValue: { state: 'loading' } as Outcome },
  );

  /** The last page shown stays on screen while the next one loads (or fails). */
  protected readonly page = linkedSignal<Outcome, AuditPage | null>({
    source: this.outcome,
    computation: (o, previous) => (o.state === 'ok' ? o.page : (previous?.value ?? null)),
  });
  protected readonly entries = computed(() => this.page()?.entries ?? []);
  protected readonly loading = computed(() => this.outcome().state === 'loading');
  protected readonly error = computed(() => {
    const o = this.outcome();
    return o.state === 'error' ? o.message : null;
  });

  protected apply(): void {
    this.applied.set(this.filters.getRawValue());
    this.pageIndex.set(0);
    this.expanded.set(null);
    this.reloads.update((n) => n + 1);
  }

  protected clear(): void {
    this.filters.reset(EMPTY_FILTER);
    this.apply();
  }

  protected retry(): void {
    this.reloads.update((n) => n + 1);
  }

  protected onPage(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
    this.expanded.set(null);
  }

  protected toggle(entry: AuditEntryView): void {
    this.expanded.update((id) => (id === entry.id ? null : entry.id));
  }

  protected readonly trackById = (_: number, entry: AuditEntryView) => entry.id;
}
