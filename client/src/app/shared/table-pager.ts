import { computed, linkedSignal, signal, type Signal, type WritableSignal } from '@angular/core';
import type { PageEvent } from '@angular/material/paginator';
import type { Sort } from '@angular/material/sort';

/** A sort a server can be asked for: a column and a direction, never "unsorted". */
export interface ColumnSort {
  readonly active: string;
  readonly direction: 'asc' | 'desc';
}

export interface TablePagerOptions {
  /** The sort the table opens with; a header clicked back to unsorted falls back to it. */
  readonly sort?: ColumnSort;
  /** Rows per page until the reader picks another size (25 unless given). */
  readonly pageSize?: number;
  /** Every change of this signal sends the table back to its first page. */
  readonly restartOn?: Signal<unknown>;
}

const UNSORTED: ColumnSort = { active: '', direction: 'asc' };

/**
 * Which page of a table is shown and in which order: the state behind a `matSort` and a
 * `mat-paginator` as signals, bound in the template and read by the page's request.
 * A new sort starts again from the first page, as a new filter should (`firstPage()`).
 */
export class TablePager {
  private readonly defaultSort: ColumnSort;
  private readonly sortState: WritableSignal<Sort>;
  private readonly index: WritableSignal<number>;
  private readonly size: WritableSignal<number>;

  /** The sort the headers show, "unsorted" (direction '') included. */
  readonly sort: Signal<Sort>;
  readonly pageIndex: Signal<number>;
  readonly pageSize: Signal<number>;

  /** The sort to ask for: the headers', or the default when they show none. */
  readonly requestedSort = computed<ColumnSort>(() => {
    const { active, direction } = this.sort();
    return direction === '' ? this.defaultSort : { active, direction };
  });
  /** How many rows come before the first one of this page. */
  readonly offset = computed(() => this.pageIndex() * this.pageSize());

  constructor(options: TablePagerOptions = {}) {
    this.defaultSort = options.sort ?? UNSORTED;
    this.sortState = signal<Sort>({ ...this.defaultSort });
    const restartOn = options.restartOn;
    this.index = linkedSignal(() => {
      restartOn?.();
      return 0;
    });
    this.size = signal(options.pageSize ?? 25);
    this.sort = this.sortState.asReadonly();
    this.pageIndex = this.index.asReadonly();
    this.pageSize = this.size.asReadonly();
  }

  /** For `(matSortChange)`. */
  sortBy(sort: Sort): void {
    this.sortState.set(sort);
    this.firstPage();
  }

  /** For `(page)` of the paginator. */
  turnPage(event: PageEvent): void {
    this.size.set(event.pageSize);
    this.index.set(event.pageIndex);
  }

  firstPage(): void {
    this.index.set(0);
  }
}
