import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  computed,
  inject,
  input,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import {
  catchError,
  EMPTY,
  filter,
  interval,
  Observable,
  Subject,
  switchMap,
  takeUntil,
} from 'rxjs';

import type {
  DraftAnswer,
  DraftChange,
  PublishStatus,
  StaleDerived,
  UpdateDraftInput,
} from '@contracts/releases/release-drafts-schemas';
import { ApiError, readableMessage } from '../../../../core/api-error';
import { DraftsApi } from '../drafts-api';
import { publishProblem } from '../draft-words';
import { ChangeTable, type IncludeToggle } from './change-table';
import { PublishDialog, type PublishDialogData } from './publish-dialog';
import { StalePanel } from './stale-panel';

/** How often the progress of a running publish is read. */
const POLL_MS = 250;

const GROUPS: readonly { kind: DraftChange['change']; title: string }[] = [
  { kind: 'changed', title: 'Changed values' },
  { kind: 'added', title: 'Added values' },
  { kind: 'retired', title: 'Retired values' },
];

/** One draft: its changes to include or leave out, notes, stale derived values, and publishing. */
@Component({
  selector: 'thalpos-draft-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
    ChangeTable,
    StalePanel,
  ],
  templateUrl: './draft-page.html',
  styleUrl: './draft-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DraftPage {
  private readonly api = inject(DraftsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  /** From the route (`:version`). */
  readonly version = input.required<string>();

  protected readonly draft = signal<DraftAnswer | null>(null);
  protected readonly stale = signal<readonly StaleDerived[]>([]);
  protected readonly loadError = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly progress = signal<PublishStatus | null>(null);
  protected readonly notes = new FormControl('', {
    nonNullable: true,
    validators: [Validators.maxLength(20000)],
  });

  protected readonly groups = computed(() => {
    const d = this.draft();
    if (!d) return [];
    return GROUPS.map((g) => ({
      ...g,
      changes: d.changes.filter((c) => c.change === g.kind),
    })).filter((g) => g.changes.length > 0);
  });
  protected readonly notesChanged = signal(false);

  constructor() {
    toObservable(this.version)
      .pipe(
        switchMap((v) => this.api.changes(v)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: (d) => {
          this.show(d);
          this.loadStale();
        },
        error: (error: unknown) => this.loadError.set(readableMessage(error)),
      });
    this.notes.valueChanges
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe((v) => this.notesChanged.set(v !== (this.draft()?.release.notes ?? '')));
  }

  private show(d: DraftAnswer): void {
    this.draft.set(d);
    this.notes.setValue(d.release.notes, { emitEvent: false });
    this.notesChanged.set(false);
  }

  private loadStale(): void {
    this.api
      .stale(this.version())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({ next: (s) => this.stale.set(s.stale), error: () => this.stale.set([]) });
  }

  /** A change to the draft (PATCH); the answer replaces what is shown. */
  private update(body: UpdateDraftInput, done?: string): void {
    this.run(this.api.update(this.version(), body), (d) => {
      this.show(d);
      this.loadStale();
      if (done) this.snackBar.open(done, undefined, { duration: 4000 });
    });
  }

  private run<T>(call: Observable<T>, next: (value: T) => void): void {
    this.busy.set(true);
    this.problem.set(null);
    call.pipe(takeUntilDestroyed(this.destroyRef)).subscribe({
      next: (value) => {
        this.busy.set(false);
        next(value);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.problem.set(publishProblem(error));
      },
    });
  }

  protected toggle(t: IncludeToggle): void {
    this.update(t.include ? { include: [t.revisionId] } : { exclude: [t.revisionId] });
  }

  protected saveNotes(): void {
    if (this.notes.invalid) return;
    this.update({ notes: this.notes.value }, 'Notes saved');
  }

  protected rebase(): void {
    this.update({ rebase: true }, 'The draft now builds on the newest release');
  }

  protected acknowledge(ids: number[]): void {
    this.run(this.api.acknowledge(this.version(), ids), (s) => {
      this.stale.set(s.stale);
      this.draft.update((d) =>
        d
          ? {
              ...d,
              counts: {
                ...d.counts,
                staleUnacknowledged: s.stale.filter((x) => !x.acknowledged).length,
              },
            }
          : d,
      );
    });
  }

  protected confirmPublish(): void {
    const d = this.draft();
    if (!d) return;
    const data: PublishDialogData = {
      version: d.release.version,
      base: d.release.base,
      included: d.counts.included,
      leftOut: d.changes.length - d.counts.included,
      acknowledged: this.stale().filter((s) => s.acknowledged).length,
    };
    this.dialog
      .open(PublishDialog, { data, autoFocus: 'dialog' })
      .afterClosed()
      .pipe(filter((ok) => ok === true))
      .subscribe(() => this.publish());
  }

  /** Publishes, reading the job's progress while the one publish transaction runs. */
  private publish(): void {
    const version = this.version();
    const finished = new Subject<void>();
    this.busy.set(true);
    this.problem.set(null);
    this.progress.set({
      version,
      phase: 'waiting',
      percent: 2,
      message: 'Starting',
      error: null,
      steps: [],
    });
    interval(POLL_MS)
      .pipe(
        switchMap(() => this.api.publishStatus(version).pipe(catchError(() => EMPTY))),
        takeUntil(finished),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe((s) => {
        if (s.phase !== 'idle' && s.phase !== 'failed') this.progress.set(s);
      });
    this.api
      .publish(version)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          finished.next();
          this.progress.update(
            (p) => p && { ...p, phase: 'done', percent: 100, message: 'Published' },
          );
          this.snackBar.open(`Release ${version} is published`, undefined, { duration: 6000 });
          void this.router.navigate(['/releases']);
        },
        error: (error: unknown) => {
          finished.next();
          this.busy.set(false);
          this.progress.set(null);
          this.problem.set(publishProblem(error));
          if (error instanceof ApiError && error.code === 'stale_derived') this.loadStale();
          if (error instanceof ApiError && error.code === 'stale_draft') {
            this.draft.update((d) => d && { ...d, release: { ...d.release, stale: true } });
          }
        },
      });
  }
}
