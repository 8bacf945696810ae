import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  numberAttribute,
  signal,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type {
  CommentView,
  ProposalDetail,
  TransitionAnswer,
} from '@contracts/proposals/proposals-schemas';
import { readableMessage } from '../../../core/api-error';
import { Session } from '../../../core/session';
import { CurationApi } from '../curation-api';
import { STATUS_WORDS, when } from '../proposal-status';
import { StatusChip } from '../status-chip';
import { CommentThread } from './comment-thread';
import { DecisionPanel, type Refusal } from './decision-panel';
import { ItemReview } from './item-review';
import { WatchlistImpactPanel } from './watchlist-impact-panel';

/** One proposal: its items compared with the record, the thread, and what the reader may do. */
@Component({
  selector: 'thalpos-proposal-page',
  imports: [
    RouterLink,
    MatButton,
    MatIcon,
    MatProgressBar,
    StatusChip,
    ItemReview,
    CommentThread,
    DecisionPanel,
    WatchlistImpactPanel,
  ],
  templateUrl: './proposal-page.html',
  styleUrls: ['../curation-page.scss', './proposal-page.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProposalPage {
  private readonly api = inject(CurationApi);
  private readonly session = inject(Session);

  readonly id = input.required({ transform: numberAttribute });

  protected readonly when = when;
  protected readonly statusWords = STATUS_WORDS;
  protected readonly proposal = signal<ProposalDetail | null>(null);
  protected readonly loading = signal(false);
  protected readonly problem = signal<string | null>(null);
  /** What just happened (a decision, a submission), or why the page changed under the reader. */
  protected readonly notice = signal<{
    kind: 'done' | 'refused';
    title: string;
    message: string;
  } | null>(null);
  protected readonly busy = signal(false);

  protected readonly own = computed(() => {
    const p = this.proposal();
    const user = this.session.user();
    return !!p && !!user && p.author.id === user.id;
  });
  /**
   * Editors and admins see the decision panel on every proposal waiting for review — their own
   * included, so the refusal is explained rather than the panel silently missing.
   */
  protected readonly showDecision = computed(
    () => this.proposal()?.status === 'submitted' && this.session.hasRole('editor', 'admin'),
  );
  protected readonly allowed = computed(() => new Set(this.proposal()?.allowed ?? []));

  constructor() {
    effect(() => void this.load(this.id()));
  }

  protected async load(id: number): Promise<void> {
    this.loading.set(true);
    try {
      this.proposal.set(await firstValueFrom(this.api.proposal(id)));
      this.problem.set(null);
    } catch (error) {
      this.problem.set(readableMessage(error));
    } finally {
      this.loading.set(false);
    }
  }

  protected onDecision(event: { answer: TransitionAnswer } | { refusal: Refusal }): void {
    if ('answer' in event) {
      this.notice.set({
        kind: 'done',
        title: `Decision saved: ${STATUS_WORDS[event.answer.status].label}.`,
        message: STATUS_WORDS[event.answer.status].means,
      });
    } else {
      this.notice.set({
        kind: 'refused',
        title: event.refusal.title,
        message: event.refusal.message,
      });
    }
    void this.load(this.id());
  }

  protected onComment(comment: CommentView): void {
    this.proposal.update((p) => (p ? { ...p, comments: [...p.comments, comment] } : p));
  }

  protected async transition(action: 'submit' | 'withdraw'): Promise<void> {
    this.busy.set(true);
    this.notice.set(null);
    try {
      const answer = await firstValueFrom(
        action === 'submit' ? this.api.submit(this.id()) : this.api.withdraw(this.id()),
      );
      this.notice.set({
        kind: 'done',
        title: STATUS_WORDS[answer.status].label,
        message: STATUS_WORDS[answer.status].means,
      });
      await this.load(this.id());
    } catch (error) {
      this.notice.set({ kind: 'refused', title: 'Not done.', message: readableMessage(error) });
    } finally {
      this.busy.set(false);
    }
  }
}
