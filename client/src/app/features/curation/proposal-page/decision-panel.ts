import { ChangeDetectionStrategy, Component, inject, input, output, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { firstValueFrom } from 'rxjs';

import type { Decision, TransitionAnswer } from '@contracts/proposals/proposals-schemas';
import { ApiError, readableMessage } from '../../../core/api-error';
import { CurationApi } from '../curation-api';

export const DECISIONS: readonly { decision: Decision; label: string; button: string }[] = [
  { decision: 'approve', label: 'Approve', button: 'Approve' },
  { decision: 'request_changes', label: 'Ask for changes', button: 'Ask for changes' },
  { decision: 'reject', label: 'Reject', button: 'Reject' },
];

/** A refusal in words: what happened and what to do next; the server's own reason beside it. */
export interface Refusal {
  readonly title: string;
  readonly message: string;
  /** The proposal changed under us: reload it. */
  readonly reload: boolean;
}

export function refusalOf(error: unknown): Refusal {
  const message = readableMessage(error);
  if (error instanceof ApiError) {
    if (error.status === 403 && error.code === 'own_proposal') {
      return {
        title: 'You cannot decide your own proposal.',
        message,
        reload: false,
      };
    }
    if (error.status === 409 && error.code === 'already_decided') {
      return { title: 'Someone else decided it first.', message, reload: true };
    }
    if (error.status === 409 && error.code === 'stale') {
      return {
        title: 'The recorded value changed since this was submitted.',
        message,
        reload: true,
      };
    }
    if (error.status === 403) {
      return { title: 'You are not allowed to decide proposals.', message, reload: false };
    }
  }
  return { title: 'The decision was not saved.', message, reload: false };
}

/** Approve, reject or ask for changes; each needs a comment. Refusals are explained in words. */
@Component({
  selector: 'thalpos-decision-panel',
  imports: [
    ReactiveFormsModule,
    MatRadioGroup,
    MatRadioButton,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatButton,
    MatIcon,
  ],
  template: `
    <form class="panel" [formGroup]="form" (ngSubmit)="decide()" aria-labelledby="decision-title">
      <h2 id="decision-title">Decision</h2>
      @if (ownProposal()) {
        <p class="note">You proposed this; another editor has to decide it.</p>
      }
      <mat-radio-group [formControl]="decision" aria-label="Decision" class="choices">
        @for (d of decisions; track d.decision) {
          <mat-radio-button [value]="d.decision">{{ d.label }}</mat-radio-button>
        }
      </mat-radio-group>
      <mat-form-field class="comment">
        <mat-label>Comment for the proposer</mat-label>
        <textarea matInput [formControl]="comment" rows="3"></textarea>
        <mat-hint>Every decision needs a comment: what you checked, or what to change.</mat-hint>
        <mat-error>Write a comment: every decision needs one.</mat-error>
      </mat-form-field>
      @if (refusal(); as r) {
        <div class="refusal" role="alert">
          <mat-icon aria-hidden="true">block</mat-icon>
          <div>
            <p class="title">{{ r.title }}</p>
            <p>{{ r.message }}</p>
          </div>
        </div>
      }
      <button matButton="filled" type="submit" [disabled]="busy()">
        {{ buttonLabel() }}
      </button>
    </form>
  `,
  styleUrl: './decision-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DecisionPanel {
  private readonly api = inject(CurationApi);

  readonly proposalId = input.required<number>();
  readonly ownProposal = input(false);
  /**
   * The proposal changed: a decision was saved (`answer`), or someone else's change got there
   * first (`refusal`, for the page to show above the reloaded proposal, as this panel may go).
   */
  readonly changed = output<{ answer: TransitionAnswer } | { refusal: Refusal }>();

  protected readonly decisions = DECISIONS;
  protected readonly decision = new FormControl<Decision>('approve', { nonNullable: true });
  protected readonly comment = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.pattern(/\S/), Validators.maxLength(10_000)],
  });
  protected readonly form = new FormGroup({ decision: this.decision, comment: this.comment });
  protected readonly busy = signal(false);
  protected readonly refusal = signal<Refusal | null>(null);

  protected buttonLabel(): string {
    return DECISIONS.find((d) => d.decision === this.decision.value)?.button ?? 'Decide';
  }

  protected async decide(): Promise<void> {
    this.comment.markAsTouched();
    if (this.comment.invalid) return;
    this.busy.set(true);
    this.refusal.set(null);
    try {
      const answer = await firstValueFrom(
        this.api.decide(this.proposalId(), this.decision.value, this.comment.value.trim()),
      );
      this.comment.reset();
      this.changed.emit({ answer });
    } catch (error) {
      const refusal = refusalOf(error);
      if (refusal.reload) this.changed.emit({ refusal });
      else this.refusal.set(refusal);
    } finally {
      this.busy.set(false);
    }
  }
}
