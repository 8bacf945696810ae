import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, combineLatest, map, Observable, of, startWith, switchMap } from 'rxjs';

import type { DocumentView, SourceDetail } from '@contracts/sources/sources-schemas';
import { httpStatus, readableMessage } from '../../../core/api-error';
import { Session } from '../../../core/session';
import { DocumentUpload } from '../../../shared/document-upload/document-upload';
import { SourcesApi } from '../../../shared/sources-api';

type Load<T> =
  | { readonly state: 'loading' }
  | { readonly state: 'loaded'; readonly value: T }
  | { readonly state: 'failed'; readonly message: string; readonly status: number | null };

function loading<T>(source: Observable<T>): Observable<Load<T>> {
  return source.pipe(
    map((value): Load<T> => ({ state: 'loaded', value })),
    catchError((error: unknown) =>
      of<Load<T>>({ state: 'failed', message: readableMessage(error), status: httpStatus(error) }),
    ),
    startWith<Load<T>>({ state: 'loading' }),
  );
}

/** One source: its citation, DOI, BibTeX and RIS downloads, and documents for those allowed. */
@Component({
  selector: 'thalpos-source-page',
  imports: [RouterLink, DatePipe, MatButton, MatIcon, MatProgressBar, DocumentUpload],
  templateUrl: './source-page.html',
  styleUrl: './source-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SourcePage {
  private readonly api = inject(SourcesApi);
  protected readonly session = inject(Session);

  /** The route's `:id` (component input binding). */
  readonly id = input.required<string>();

  /** Curators and up may attach documents; who may read them the server decides. */
  protected readonly mayAttach = computed(() => this.session.hasRole('curator', 'editor', 'admin'));
  private readonly reloadDocuments = signal(0);

  private readonly source = toSignal(
    toObservable(this.id).pipe(switchMap((id) => loading(this.api.source(id)))),
    { initialValue: { state: 'loading' } as Load<SourceDetail> },
  );
  private readonly documents = toSignal(
    combineLatest([
      toObservable(this.id),
      toObservable(this.mayAttach),
      toObservable(this.reloadDocuments),
    ]).pipe(
      switchMap(([id, may]) =>
        may
          ? loading(this.api.documents(id))
          : of<Load<{ documents: DocumentView[] }>>({ state: 'loaded', value: { documents: [] } }),
      ),
    ),
    { initialValue: { state: 'loading' } as Load<{ documents: DocumentView[] }> },
  );

  protected readonly detail = computed(() => {
    const s = this.source();
    return s.state === 'loaded' ? s.value : null;
  });
  protected readonly problem = computed(() => {
    const s = this.source();
    return s.state === 'failed' ? s.message : null;
  });
  protected readonly docs = computed(() => {
    const d = this.documents();
    return d.state === 'loaded' ? d.value.documents : [];
  });
  /** 403: there are documents, but none this user uploaded, and only editors read them all. */
  protected readonly docsHidden = computed(() => {
    const d = this.documents();
    return d.state === 'failed' && d.status === 403;
  });
  protected readonly docsProblem = computed(() => {
    const d = this.documents();
    return d.state === 'failed' && d.status !== 403 ? d.message : null;
  });

  protected bibtexUrl = (id: string) => this.api.bibtexUrl(id);
  protected risUrl = (id: string) => this.api.risUrl(id);
  protected documentUrl = (doc: DocumentView) => this.api.documentUrl(doc.sourceId, doc.id);

  /** "840 kB", "3.2 MB": a size as people read it. */
  protected sizeText(bytes: number): string {
    if (bytes < 1024 * 1024) return `${Math.max(1, Math.round(bytes / 1024))} kB`;
    return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  }

  protected attached(): void {
    this.reloadDocuments.update((n) => n + 1);
  }
}
