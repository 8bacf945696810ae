import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatCheckbox } from '@angular/material/checkbox';
import {
  MatCell,
  MatCellDef,
  MatColumnDef,
  MatHeaderCell,
  MatHeaderCellDef,
  MatHeaderRow,
  MatHeaderRowDef,
  MatRow,
  MatRowDef,
  MatTable,
} from '@angular/material/table';

import type { DraftChange } from '@contracts/releases/release-drafts-schemas';
import { ChemText } from '../../../../shared/chem-text';
import { phaseLabel } from '../../../../shared/phase-name';
import { differenceText, quantityLabel, sideText } from '../draft-words';

export interface IncludeToggle {
  readonly revisionId: number;
  readonly include: boolean;
}

/** One group of a draft's changes (added, changed or retired), each with its include box. */
@Component({
  selector: 'thalpos-change-table',
  imports: [
    ChemText,
    MatCheckbox,
    MatTable,
    MatColumnDef,
    MatHeaderCell,
    MatHeaderCellDef,
    MatCell,
    MatCellDef,
    MatHeaderRow,
    MatHeaderRowDef,
    MatRow,
    MatRowDef,
  ],
  template: `
    <div class="table-scroll">
      <table mat-table [dataSource]="rows()" [trackBy]="trackById" [attr.aria-label]="label()">
        <ng-container matColumnDef="include">
          <th mat-header-cell *matHeaderCellDef scope="col">Include</th>
          <td mat-cell *matCellDef="let c">
            <mat-checkbox
              [checked]="c.change.included"
              [disabled]="busy()"
              [aria-label]="'Include ' + c.title"
              (change)="toggled.emit({ revisionId: c.change.revisionId, include: $event.checked })"
            />
          </td>
        </ng-container>
        <ng-container matColumnDef="species">
          <th mat-header-cell *matHeaderCellDef scope="col">Species</th>
          <td mat-cell *matCellDef="let c">
            <span class="name">{{ c.change.species.name }}</span>
            <span class="formula">{{ c.change.species.formula + c.phase | chemText }}</span>
            <span class="quantity">{{ c.quantity }}</span>
          </td>
        </ng-container>
        <ng-container matColumnDef="old">
          <th mat-header-cell *matHeaderCellDef scope="col">Old</th>
          <td mat-cell *matCellDef="let c" [title]="c.change.old?.source.citation ?? ''">
            {{ c.old }}
          </td>
        </ng-container>
        <ng-container matColumnDef="new">
          <th mat-header-cell *matHeaderCellDef scope="col">New</th>
          <td mat-cell *matCellDef="let c" [title]="c.change.new?.source.citation ?? ''">
            {{ c.new }}
            @if (c.change.new; as n) {
              <span class="source">{{ n.source.citation }}</span>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="difference">
          <th mat-header-cell *matHeaderCellDef scope="col">Difference</th>
          <td mat-cell *matCellDef="let c" class="difference">{{ c.difference }}</td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns()"></tr>
        <tr
          mat-row
          *matRowDef="let c; columns: columns()"
          [class.left-out]="!c.change.included"
        ></tr>
      </table>
    </div>
  `,
  styleUrl: './change-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangeTable {
  readonly changes = input.required<readonly DraftChange[]>();
  readonly kind = input.required<DraftChange['change']>();
  readonly label = input.required<string>();
  readonly busy = input(false);
  readonly toggled = output<IncludeToggle>();

  protected readonly trackById = (_: number, row: { change: DraftChange }) => row.change.revisionId;

  /** Added values have no old side and no difference; retired ones no new side. */
  protected readonly columns = computed(() => {
    switch (this.kind()) {
      case 'added':
        return ['include', 'species', 'new'];
      case 'retired':
        return ['include', 'species', 'old'];
      default:
        return ['include', 'species', 'old', 'new', 'difference'];
    }
  });

  protected readonly rows = computed(() =>
    this.changes().map((change) => ({
      change,
      phase: phaseLabel(change.phase, change.modification),
      quantity: quantityLabel(change.quantity),
      title: `${change.species.name} ${phaseLabel(change.phase, change.modification)} ${quantityLabel(change.quantity)}`,
      old: sideText(change.old),
      new: sideText(change.new),
      difference: differenceText(change),
    })),
  );
}
