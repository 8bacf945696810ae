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
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import {
  catchError,
  debounceTime,
  distinctUntilChanged,
  firstValueFrom,
  map,
  of,
  startWith,
  switchMap,
} from 'rxjs';

import type {
  CheckAnswer,
  CreateProposalBody,
  ProposalDetail,
  ProposalItemInput,
} from '@contracts/proposals/proposals-schemas';
import { readableMessage } from '../../../core/api-error';
import { CurationApi } from '../curation-api';
import { ItemEditor } from '../item-editor/item-editor';
import { when } from '../proposal-status';
import { StatusChip } from '../status-chip';
import { type ItemForm, itemForm } from './item-form';
import { fromItemInput, toItemInput } from './item-input';

/** Quiet time after the last change before the items are checked by the server. */
export const CHECK_DEBOUNCE_MS = 400;

interface LiveCheck {
  readonly issues: CheckAnswer['issues'];
  readonly warnings: CheckAnswer['warnings'];
}
const NO_CHECK: LiveCheck = { issues: [], warnings: [] };

/**
 * Propose: a rationale and one or more items, checked live by the server (formulas through the
 * engine, likely duplicates), saved as a draft, submitted, withdrawn, or revised after an editor
 * asked for changes (their comments shown above the form).
 */
@Component({
  selector: 'thalpos-proposal-form',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatButton,
    MatIcon,
    MatProgressBar,
    ItemEditor,
    StatusChip,
  ],
  templateUrl: './proposal-form.html',
  styleUrl: './proposal-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProposalForm {
  private readonly api = inject(CurationApi);
  private readonly router = inject(Router);

  /** The proposal being revised (route `proposals/:id/edit`); absent for a new one. */
  readonly id = input(undefined, {
    transform: (v: unknown) => (v == null ? undefined : numberAttribute(v)),
  });

  protected readonly when = when;
  protected readonly rationale = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.maxLength(10_000)],
  });
  protected readonly items = new FormArray<ItemForm>([itemForm()]);
  protected readonly form = new FormGroup({ rationale: this.rationale, items: this.items });

  protected readonly existing = signal<ProposalDetail | null>(null);
  protected readonly loading = signal(false);
  protected readonly busy = signal(false);
  protected readonly problem = signal<string | null>(null);

  /** Editors' comments to answer when the proposal came back with "changes requested". */
  protected readonly reviewComments = computed(
    () => this.existing()?.comments.filter((c) => c.author.id !== this.existing()?.author.id) ?? [],
  );
  protected readonly canRevise = computed(() => {
    const existing = this.existing();
    return !existing || existing.allowed.includes('revise');
  });

  /**
   * The server's check of the items as typed. Only items complete enough to send are checked
   * (the rest show their own field errors); answers are mapped back to each item's position.
   */
  protected readonly check = toSignal(
    this.items.valueChanges.pipe(
      debounceTime(CHECK_DEBOUNCE_MS),
      map(() => this.checkable()),
      distinctUntilChanged((a, b) => JSON.stringify(a) === JSON.stringify(b)),
      switchMap(({ positions, items }) =>
        items.length === 0
          ? of(NO_CHECK)
          : this.api.check(items).pipe(
              map((answer): LiveCheck => ({
                issues: answer.issues.map((i) => ({ ...i, index: positions[i.index] ?? -1 })),
                warnings: answer.warnings.map((w) => ({ ...w, index: positions[w.index] ?? -1 })),
              })),
              // A failed check is not a verdict: saving checks again.
              catchError(() => of(NO_CHECK)),
            ),
      ),
      startWith(NO_CHECK),
    ),
    { initialValue: NO_CHECK },
  );

  protected issuesOf(index: number) {
    return this.check().issues.filter((i) => i.index === index);
  }
  protected warningsOf(index: number) {
    return this.check().warnings.filter((w) => w.index === index);
  }

  constructor() {
    effect(() => {
      const id = this.id();
      if (id !== undefined) void this.load(id);
    });
    this.items.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => this.problem.set(null));
  }

  protected addItem(): void {
    // A new item starts with the previous one's species, source and evidence settings.
    const last = this.items.at(this.items.length - 1)?.getRawValue();
    this.items.push(
      itemForm(
        last
          ? {
              kind: last.kind,
              species: last.species,
              phase: last.phase,
              sourceId: last.sourceId,
              unit: last.unit,
              uncertaintyBasis: last.uncertaintyBasis,
              standardPressure: last.standardPressure,
            }
          : {},
      ),
    );
  }

  protected removeItem(index: number): void {
    if (this.items.length > 1) this.items.removeAt(index);
  }

  /** Saves a draft (new or revised); returns its id, or null when refused. */
  protected async save(thenSubmit = false): Promise<void> {
    this.rationale.markAsTouched();
    this.items.controls.forEach((item) => item.markAllAsTouched());
    if (this.rationale.invalid || this.items.invalid) {
      this.problem.set('Some fields need attention (marked in red).');
      return;
    }
    const body: CreateProposalBody = {
      rationale: this.rationale.value.trim(),
      items: this.items.controls.map((item) => toItemInput(item.getRawValue())),
    };
    this.busy.set(true);
    this.problem.set(null);
    try {
      const existing = this.existing();
      const id = existing
        ? (await firstValueFrom(this.api.revise(existing.id, body))).id
        : (await firstValueFrom(this.api.create(body))).id;
      if (thenSubmit) await firstValueFrom(this.api.submit(id));
      await this.router.navigate(['/curation/proposals', id]);
    } catch (error) {
      this.problem.set(readableMessage(error));
    } finally {
      this.busy.set(false);
    }
  }

  protected async withdraw(): Promise<void> {
    const existing = this.existing();
    if (!existing) return;
    this.busy.set(true);
    try {
      await firstValueFrom(this.api.withdraw(existing.id));
      await this.router.navigate(['/curation/proposals', existing.id]);
    } catch (error) {
      this.problem.set(readableMessage(error));
    } finally {
      this.busy.set(false);
    }
  }

  private async load(id: number): Promise<void> {
    this.loading.set(true);
    try {
      const detail = await firstValueFrom(this.api.proposal(id));
      this.existing.set(detail);
      this.rationale.setValue(detail.rationale);
      this.items.clear();
      for (const item of detail.items) this.items.push(itemForm(fromItemInput(item.input)));
      if (this.items.length === 0) this.items.push(itemForm());
    } catch (error) {
      this.problem.set(readableMessage(error));
    } finally {
      this.loading.set(false);
    }
  }

  /** Items valid enough to check, with their positions in the form. */
  private checkable(): { positions: number[]; items: ProposalItemInput[] } {
    const positions: number[] = [];
    const items: ProposalItemInput[] = [];
    this.items.controls.forEach((item, index) => {
      if (item.valid) {
        positions.push(index);
        items.push(toItemInput(item.getRawValue()));
      }
    });
    return { positions, items };
  }
}
