import { ChangeDetectionStrategy, Component, computed, input, linkedSignal } from '@angular/core';
import { MatPaginator } from '@angular/material/paginator';
import { MatSlideToggle } from '@angular/material/slide-toggle';
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

import type { PreviewRow, UploadPreview as Preview } from '@contracts/uploads/uploads-schemas';
import { TablePager } from '../../../../shared/table-pager';
import { LAYOUT_WORDS, rowAction, rowSummary } from '../upload-words';

/**
 * The dry run's rows: what each becomes and, highlighted, what is wrong with it and in which
 * column. Paged on the client (a file has at most 20,000 rows); rows with errors can be shown
 * alone.
 */
@Component({
  selector: 'thalpos-upload-preview',
  imports: [
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
    MatPaginator,
    MatSlideToggle,
  ],
  templateUrl: './upload-preview.html',
  styleUrl: './upload-preview.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadPreview {
  readonly preview = input.required<Preview>();

  protected readonly columns = ['line', 'type', 'row', 'action', 'problems'];
  protected readonly summary = rowSummary;
  protected readonly action = rowAction;

  /** A long file with problems opens on its problem rows; every new file on its first page. */
  protected readonly onlyErrors = linkedSignal(
    () => this.preview().errorRowCount > 0 && this.preview().rowCount > 10,
  );
  protected readonly pager = new TablePager({ restartOn: this.preview });

  protected readonly shown = computed(() => {
    const rows = this.preview().rows;
    return this.onlyErrors() ? rows.filter((r) => r.errors.length > 0) : rows;
  });
  protected readonly page = computed(() => {
    const start = this.pager.offset();
    return this.shown().slice(start, start + this.pager.pageSize());
  });

  protected toggleErrors(only: boolean): void {
    this.onlyErrors.set(only);
    this.pager.firstPage();
  }

  protected typeWord(row: PreviewRow): string {
    return LAYOUT_WORDS[row.layout];
  }

  protected errorsOf(row: PreviewRow): PreviewRow['errors'] {
    return row.errors;
  }

  protected fileErrorText(e: Preview['fileErrors'][number]): string {
    return e.line ? `Line ${e.line}: ${e.message}` : e.message;
  }

  protected problemText(problem: PreviewRow['errors'][number]): string {
    return problem.column ? `${problem.column}: ${problem.message}` : problem.message;
  }
}
