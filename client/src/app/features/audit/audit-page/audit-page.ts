import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
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
import type { AuditEntryView } from '@contracts/audit/audit-schemas';

import { latestResponse } from '../../../shared/latest-response';
import { phoneWidth } from '../../../shared/phone-width';
import { TablePager } from '../../../shared/table-pager';
import { AuditApi } from '../audit-api';
import { auditRequest, formatState, type AuditFilterValue } from './audit-filter';

const EMPTY_FILTER: AuditFilterValue = {
  actor: '',
  action: '',
  entityType: '',
  entityId: '',
  fromDay: '',
  toDay: '',
};

const COLUMNS = ['at', 'actor', 'action', 'entity', 'expand'];
const PHONE_COLUMNS = ['at', 'action', 'expand'];

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

  /** On a phone, who and which record move under the action (see the template). */
  protected readonly phone = phoneWidth();
  protected readonly columns = computed(() => (this.phone() ? PHONE_COLUMNS : COLUMNS));
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
  protected readonly pager = new TablePager();
  protected readonly expanded = signal<number | null>(null);

  private readonly request = computed(() =>
    auditRequest(this.applied(), this.pager.pageIndex(), this.pager.pageSize()),
  );

  /** The last page shown stays on screen while the next one loads (or fails). */
  private readonly outcome = latestResponse({
    request: this.request,
    load: (request) => this.api.list(request),
    keepOnFailure: true,
  });
  protected readonly page = this.outcome.last;
  protected readonly entries = computed(() => this.page()?.entries ?? []);
  protected readonly loading = this.outcome.loading;
  protected readonly error = this.outcome.failure;

  protected apply(): void {
    this.applied.set(this.filters.getRawValue());
    this.pager.firstPage();
    this.expanded.set(null);
    // The same filters applied again ask again.
    this.outcome.reload();
  }

  protected clear(): void {
    this.filters.reset(EMPTY_FILTER);
    this.apply();
  }

  protected retry(): void {
    this.outcome.reload();
  }

  protected onPage(event: PageEvent): void {
    this.pager.turnPage(event);
    this.expanded.set(null);
  }

  protected toggle(entry: AuditEntryView): void {
    this.expanded.update((id) => (id === entry.id ? null : entry.id));
  }

  protected readonly trackById = (_: number, entry: AuditEntryView) => entry.id;
}
