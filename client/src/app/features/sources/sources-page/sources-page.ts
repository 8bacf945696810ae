import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatPaginator, type PageEvent } from '@angular/material/paginator';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import {
  catchError,
  combineLatest,
  debounceTime,
  distinctUntilChanged,
  map,
  of,
  startWith,
  switchMap,
  tap,
} from 'rxjs';

import type { SourceList } from '@contracts/sources/sources-schemas';
import { readableMessage } from '../../../core/api-error';
import { Session } from '../../../core/session';
import { AddSourceDialog } from '../../../shared/add-source-dialog/add-source-dialog';
import { SourcesApi, type AddedSource } from '../../../shared/sources-api';

type Load =
  | { readonly state: 'loading' }
  | { readonly state: 'loaded'; readonly list: SourceList }
  | { readonly state: 'failed'; readonly message: string };

/** Every registered source, newest first, searchable by citation or DOI. */
@Component({
  selector: 'thalpos-sources-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormField,
    MatLabel,
    MatSuffix,
    MatInput,
    MatButton,
    MatIcon,
    MatPaginator,
    MatProgressBar,
  ],
  templateUrl: './sources-page.html',
  styleUrl: './sources-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SourcesPage {
  private readonly api = inject(SourcesApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  protected readonly session = inject(Session);

  protected readonly canAdd = computed(() => this.session.hasRole('curator', 'editor', 'admin'));
  protected readonly query = new FormControl('', { nonNullable: true });
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(20);

  private readonly load = toSignal(
    combineLatest([
      this.query.valueChanges.pipe(
        debounceTime(250),
        map((q) => q.trim()),
        distinctUntilChanged(),
        tap(() => this.pageIndex.set(0)),
        startWith(''),
      ),
      toObservable(this.pageIndex),
      toObservable(this.pageSize),
    ]).pipe(
      switchMap(([q, page, size]) =>
        this.api.list(q, page * size, size).pipe(
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
  protected readonly list = computed(() => {
    const l = this.load();
    return l.state === 'loaded' ? l.list : null;
  });
  protected readonly problem = computed(() => {
    const l = this.load();
    return l.state === 'failed' ? l.message : null;
  });

  protected page(event: PageEvent): void {
    this.pageSize.set(event.pageSize);
    this.pageIndex.set(event.pageIndex);
  }

  protected add(): void {
    this.dialog
      .open<AddSourceDialog, void, AddedSource>(AddSourceDialog, { autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((added) => {
        if (added) void this.router.navigate(['/sources', added.source.id]);
      });
  }
}
