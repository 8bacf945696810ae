import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { firstValueFrom } from 'rxjs';

import type { CommentView } from '@contracts/proposals/proposals-schemas';
import { readableMessage } from '../../../core/api-error';
import { CurationApi } from '../curation-api';
import { when } from '../proposal-status';

const DECISION_WORDS: Readonly<Record<NonNullable<CommentView['decision']>, string>> = {
  approve: 'approved',
  reject: 'rejected',
  request_changes: 'asked for changes',
};

/** The proposal's comments, oldest first, with a box to add one. */
@Component({
  selector: 'thalpos-comment-thread',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatError, MatInput, MatButton],
  template: `
    <h2 id="comments-title">Comments</h2>
    @if (comments().length === 0) {
      <p class="none">No comments yet.</p>
    } @else {
      <ol class="thread" aria-labelledby="comments-title">
        @for (c of comments(); track c.id) {
          <li [class.decision]="c.decision">
            <p class="meta">
              <strong>{{ c.author.name || c.author.login }}</strong>
              @if (c.decision) {
                {{ decisionWords[c.decision] }}
              }
              · {{ when(c.createdAt) }}
            </p>
            <p class="body">{{ c.body }}</p>
          </li>
        }
      </ol>
    }
    @if (canComment()) {
      <form [formGroup]="form" (ngSubmit)="send()" class="add" aria-label="Add a comment">
        <mat-form-field class="field">
          <mat-label>Add a comment</mat-label>
          <textarea matInput [formControl]="body" rows="2"></textarea>
          <mat-error>Write something first.</mat-error>
        </mat-form-field>
        @if (problem(); as message) {
          <p class="problem" role="alert">{{ message }}</p>
        }
        <button matButton="outlined" type="submit" [disabled]="busy()">Comment</button>
      </form>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    h2 {
      margin: 0 0 8px;
      font: var(--mat-sys-title-medium);
    }
    .thread {
      list-style: none;
      margin: 0 0 12px;
      padding: 0;
      display: grid;
      gap: 10px;
    }
    li {
      padding: 8px 12px;
      border-left: 3px solid var(--mat-sys-outline-variant);
    }
    li.decision {
      border-left-color: var(--mat-sys-primary);
    }
    p {
      margin: 0;
    }
    .meta {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    .body {
      white-space: pre-line;
      overflow-wrap: anywhere;
    }
    .field {
      width: 100%;
    }
    .problem {
      color: var(--mat-sys-error);
      margin-bottom: 8px;
    }
    .none {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CommentThread {
  private readonly api = inject(CurationApi);

  readonly proposalId = input.required<number>();
  readonly comments = input.required<readonly CommentView[]>();
  readonly canComment = input(true);
  readonly added = output<CommentView>();

  protected readonly when = when;
  protected readonly decisionWords = DECISION_WORDS;
  protected readonly body = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.pattern(/\S/)],
  });
  protected readonly form = new FormGroup({ body: this.body });
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  protected async send(): Promise<void> {
    this.body.markAsTouched();
    if (this.body.invalid) return;
    this.busy.set(true);
    this.problem.set(null);
    try {
      const answer = await firstValueFrom(
        this.api.comment(this.proposalId(), this.body.value.trim()),
      );
      this.body.reset();
      this.added.emit(answer.comment);
    } catch (error) {
      this.problem.set(readableMessage(error));
    } finally {
      this.busy.set(false);
    }
  }
}
