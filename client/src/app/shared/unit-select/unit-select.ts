import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';

import { ENERGY_UNITS, type EnergyUnit } from '../energy-unit';

/** Select for a molar energy unit, bound to a typed form control. */
@Component({
  selector: 'thalpos-unit-select',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatSelect, MatOption],
  template: `
    <mat-form-field>
      <mat-label>Unit</mat-label>
      <mat-select [formControl]="control()" aria-label="Unit">
        @for (unit of units; track unit) {
          <mat-option [value]="unit">{{ unit }}</mat-option>
        }
      </mat-select>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: inline-block;
      width: 10rem;
    }
    mat-form-field {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnitSelect {
  readonly control = input.required<FormControl<EnergyUnit>>();
  protected readonly units = ENERGY_UNITS;
}
