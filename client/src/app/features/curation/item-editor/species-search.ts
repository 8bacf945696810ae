import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { inject } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatAutocomplete, MatAutocompleteTrigger } from '@angular/material/autocomplete';
import { MatOption } from '@angular/material/core';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import {
  catchError,
  debounceTime,
  distinctUntilChanged,
  map,
  of,
  startWith,
  switchMap,
} from 'rxjs';

import type { SearchResult } from '@contracts/search/search-schemas';
import { ChemText } from '../../../shared/chem-text';
import { phaseName } from '../../../shared/phase-name';
import { BrowseApi } from '../../browse/browse-api';

/** Quiet time after the last keystroke before the registry is searched. */
export const SPECIES_SEARCH_DEBOUNCE_MS = 250;

/**
 * A species field: the registry key as the value, found by name, formula, CAS RN or InChIKey
 * through the same search as Browse (typos forgiven).
 */
@Component({
  selector: 'thalpos-species-search',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatAutocomplete,
    MatAutocompleteTrigger,
    MatOption,
    ChemText,
  ],
  template: `
    <mat-form-field class="field">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        type="text"
        autocomplete="off"
        spellcheck="false"
        [formControl]="control()"
        [matAutocomplete]="auto"
        [attr.aria-label]="label()"
      />
      <mat-autocomplete #auto="matAutocomplete">
        @for (hit of hits(); track hit.key) {
          <mat-option [value]="hit.key">
            <span class="name">{{ hit.name }}</span>
            <span class="formula">{{ hit.formula | chemText }}</span>
            <span class="phases">{{ phaseWords(hit) }}</span>
          </mat-option>
        }
      </mat-autocomplete>
      <mat-hint>Type a name, formula, CAS RN or InChIKey and pick the species.</mat-hint>
      <mat-error>Pick a species.</mat-error>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: block;
    }
    .field {
      width: 100%;
    }
    .name {
      font-weight: 500;
      margin-right: 8px;
    }
    .phases {
      margin-left: 8px;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpeciesSearch {
  private readonly api = inject(BrowseApi);

  readonly control = input.required<FormControl<string>>();
  readonly label = input('Species');

  protected readonly hits = toSignal(
    toObservable(this.control).pipe(
      switchMap((control) => control.valueChanges.pipe(startWith(control.value))),
      map((q) => q.trim()),
      debounceTime(SPECIES_SEARCH_DEBOUNCE_MS),
      distinctUntilChanged(),
      switchMap((q) =>
        q.length < 1
          ? of<SearchResult[]>([])
          : this.api.search(q, 'latest').pipe(
              map((answer) => answer.results),
              catchError(() => of<SearchResult[]>([])),
            ),
      ),
    ),
    { initialValue: [] as SearchResult[] },
  );

  protected phaseWords(hit: SearchResult): string {
    return hit.phases.map((p) => phaseName(p.phase, p.modification)).join(', ');
  }
}
