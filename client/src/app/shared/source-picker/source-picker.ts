import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  forwardRef,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import {
  FormControl,
  NG_VALUE_ACCESSOR,
  ReactiveFormsModule,
  type ControlValueAccessor,
} from '@angular/forms';
import {
  MatAutocomplete,
  MatAutocompleteTrigger,
  type MatAutocompleteSelectedEvent,
} from '@angular/material/autocomplete';
import { MatButton } from '@angular/material/button';
import { MatOption } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import {
  catchError,
  debounceTime,
  distinctUntilChanged,
  filter,
  map,
  of,
  startWith,
  switchMap,
} from 'rxjs';

import type { SourceAnswer } from '@contracts/sources/sources-schemas';
import { AddSourceDialog } from '../add-source-dialog/add-source-dialog';
import { SourcesApi, type AddedSource } from '../sources-api';

/**
 * Chooses a source for a form: search the registered sources by citation or DOI, or add a new
 * one through the Add source dialog. A form control whose value is the source id (a string, as
 * the API names it) or null; `sourceChange` also gives the chosen source with its citation.
 *
 *   <thalpos-source-picker formControlName="sourceId" (sourceChange)="source.set($event)" />
 */
@Component({
  selector: 'thalpos-source-picker',
  imports: [
    ReactiveFormsModule,
    MatFormField,
    MatLabel,
    MatHint,
    MatInput,
    MatAutocomplete,
    MatAutocompleteTrigger,
    MatOption,
    MatButton,
    MatIcon,
  ],
  templateUrl: './source-picker.html',
  styleUrl: './source-picker.scss',
  providers: [
    { provide: NG_VALUE_ACCESSOR, useExisting: forwardRef(() => SourcePicker), multi: true },
  ],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SourcePicker implements ControlValueAccessor {
  private readonly api = inject(SourcesApi);
  private readonly dialog = inject(MatDialog);
  private readonly destroyRef = inject(DestroyRef);

  /** The field's label. */
  readonly label = input('Source');
  /** Whether "Add new source" is offered (curators, editors and admins may add). */
  readonly allowAdd = input(true);
  /** The chosen source, or null when the choice is cleared. */
  readonly sourceChange = output<SourceAnswer | null>();

  protected readonly selected = signal<SourceAnswer | null>(null);
  protected readonly disabled = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly query = new FormControl('', { nonNullable: true });

  protected readonly matches = toSignal(
    this.query.valueChanges.pipe(
      filter((q): q is string => typeof q === 'string'),
      debounceTime(250),
      map((q) => q.trim()),
      distinctUntilChanged(),
      switchMap((q) =>
        this.api.list(q, 0, 10).pipe(
          map((page) => page.items),
          catchError(() => of<SourceAnswer[]>([])),
          startWith<SourceAnswer[]>([]),
        ),
      ),
    ),
    { initialValue: [] as SourceAnswer[] },
  );

  private onChange: (id: string | null) => void = () => undefined;
  protected onTouched: () => void = () => undefined;

  writeValue(id: string | number | null): void {
    const wanted = id === null || id === undefined || id === '' ? null : String(id);
    if (wanted === (this.selected()?.id ?? null)) return;
    if (wanted === null) {
      this.selected.set(null);
      return;
    }
    // Show the id until the citation arrives, so the choice is never blank.
    this.selected.set({ id: wanted, citation: `Source ${wanted}`, doi: null });
    this.api
      .source(wanted)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (s) => {
          if (this.selected()?.id === wanted) {
            this.selected.set({ id: s.id, citation: s.citation, doi: s.doi });
          }
        },
        error: () => this.problem.set(`Source ${wanted} could not be read.`),
      });
  }

  registerOnChange(fn: (id: string | null) => void): void {
    this.onChange = fn;
  }

  registerOnTouched(fn: () => void): void {
    this.onTouched = fn;
  }

  setDisabledState(disabled: boolean): void {
    this.disabled.set(disabled);
    if (disabled) this.query.disable({ emitEvent: false });
    else this.query.enable({ emitEvent: false });
  }

  protected readonly display = (s: SourceAnswer | string | null): string =>
    typeof s === 'string' ? s : (s?.citation ?? '');

  protected picked(event: MatAutocompleteSelectedEvent): void {
    this.choose(event.option.value as SourceAnswer);
  }

  protected clear(): void {
    this.query.setValue('', { emitEvent: false });
    this.choose(null);
  }

  protected addNew(): void {
    this.dialog
      .open<AddSourceDialog, void, AddedSource>(AddSourceDialog, { autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((added) => {
        if (added) this.choose(added.source);
      });
  }

  private choose(source: SourceAnswer | null): void {
    this.problem.set(null);
    this.selected.set(source);
    this.onChange(source?.id ?? null);
    this.onTouched();
    this.sourceChange.emit(source);
  }
}
