import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatAutocomplete, MatAutocompleteTrigger } from '@angular/material/autocomplete';
import { MatButton } from '@angular/material/button';
import { MatOption } from '@angular/material/core';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSelect } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { map, startWith, switchMap } from 'rxjs';

import type { ItemIssue, ItemWarning } from '@contracts/proposals/proposals-schemas';
import { ChemText } from '../../../shared/chem-text';
import { DocumentUpload } from '../../../shared/document-upload/document-upload';
import { SourcePicker } from '../../../shared/source-picker/source-picker';
import { NumberInput } from '../../../shared/number-input/number-input';
import { phaseName } from '../../../shared/phase-name';
import { UnitSelect } from '../../../shared/unit-select/unit-select';
import { EquationField } from '../../calculate/equation-field/equation-field';
import {
  HEAT_CAPACITY_FORMS,
  ITEM_KINDS,
  type ItemForm,
  METHODS,
  PHASES,
  QUANTITIES,
  STANDARD_PRESSURES,
  UNCERTAINTY_BASES,
} from '../proposal-form/item-form';
import { siPreview } from '../proposal-form/si-preview';
import { SpeciesSearch } from './species-search';

/** One item of a proposal: what it changes, the value with its evidence, and its source. */
@Component({
  selector: 'thalpos-item-editor',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatSelect,
    MatOption,
    MatAutocomplete,
    MatAutocompleteTrigger,
    MatButton,
    MatIcon,
    ChemText,
    NumberInput,
    UnitSelect,
    EquationField,
    SpeciesSearch,
    SourcePicker,
    DocumentUpload,
  ],
  templateUrl: './item-editor.html',
  styleUrl: './item-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ItemEditor {
  readonly form = input.required<ItemForm>();
  /** 0-based position in the proposal; shown counting from 1. */
  readonly index = input.required<number>();
  readonly removable = input(true);
  /** The server's live check of this item: problems block saving, warnings do not. */
  readonly issues = input<readonly ItemIssue[]>([]);
  readonly warnings = input<readonly ItemWarning[]>([]);
  readonly remove = output<void>();

  protected readonly kinds = ITEM_KINDS;
  protected readonly quantities = QUANTITIES;
  protected readonly bases = UNCERTAINTY_BASES;
  protected readonly methods = METHODS;
  protected readonly pressures = STANDARD_PRESSURES;
  protected readonly heatCapacityForms = HEAT_CAPACITY_FORMS;
  protected readonly phases = PHASES;
  protected readonly phaseName = phaseName;

  /** The item's raw value as typed, as a signal (kind, quantity and numbers drive the view). */
  protected readonly value = toSignal(
    toObservable(this.form).pipe(
      switchMap((form) =>
        form.valueChanges.pipe(
          startWith(null),
          map(() => form.getRawValue()),
        ),
      ),
    ),
  );
  protected readonly kind = computed(() => this.value()?.kind ?? 'add_value');
  protected readonly quantity = computed(() => this.value()?.quantity ?? 'formation_enthalpy');
  protected readonly isValue = computed(() =>
    ['add_value', 'supersede_value', 'derive_value'].includes(this.kind()),
  );
  protected readonly measured = computed(
    () => this.kind() === 'derive_value' || (this.isValue() && this.quantity() !== 'heat_capacity'),
  );

  /** What the server will store, in J/mol, as the value is typed. */
  protected readonly si = computed(() => {
    const v = this.value();
    return v && v.unit !== 'J/mol' ? siPreview(v.value, v.unit) : '';
  });
  protected readonly valueLabel = computed(() => {
    if (this.kind() === 'derive_value') return 'Measured ΔrH°';
    return this.quantity() === 'transition' ? 'ΔtrsH°' : 'ΔfH° at 298.15 K';
  });

  /** Problems the server found in a field of this item, by field name (`formula`). */
  protected readonly fieldIssues = computed(() => {
    const byField = new Map<string, string>();
    for (const issue of this.issues()) {
      const field = /\]\.(\w+)/.exec(issue.path)?.[1] ?? '';
      if (!byField.has(field)) byField.set(field, issue.message);
    }
    return byField;
  });
  /** Problems not tied to a field shown on screen, listed under the item. */
  protected readonly otherIssues = computed(() =>
    this.issues().filter((issue) => {
      const field = /\]\.(\w+)/.exec(issue.path)?.[1] ?? '';
      return !['formula', 'equation'].includes(field);
    }),
  );

  protected rangesMessage(): string {
    const errors = this.form().controls.ranges.errors;
    return (errors?.['ranges'] as { message?: string } | undefined)?.message ?? '';
  }
}
