import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';

import type { ImpactAnswer, ImpactSide } from '@contracts/watchlists/watchlists-schemas';
import { formatValue } from '../../../shared/energy-unit';
import { ChemText } from '../../../shared/chem-text';

const minus = (text: string) => text.replace('-', '−');

/** One impact report: ΔrH in both releases, the change, flagged where it exceeds the uncertainty. */
@Component({
  selector: 'thalpos-impact-table',
  imports: [MatIcon, ChemText],
  template: `
    @let r = report();
    <p class="summary" role="status">
      {{ r.count }} {{ r.count === 1 ? 'reaction' : 'reactions' }} from {{ r.from }} to {{ r.to }}:
      <strong>{{ r.exceeding }}</strong> changed by more than the combined uncertainty{{
        r.errors ? '; ' + r.errors + ' could not be computed' : ''
      }}.
    </p>
    <div class="table-scroll">
      <table class="impact" aria-label="Impact report">
        <thead>
          <tr>
            <th scope="col">Reaction</th>
            <th scope="col" class="num">ΔrH {{ r.from }}</th>
            <th scope="col" class="num">ΔrH {{ r.to }}</th>
            <th scope="col" class="num">Change ({{ r.unit }})</th>
            <th scope="col" class="num">± combined</th>
          </tr>
        </thead>
        <tbody>
          @for (item of r.results; track item.index) {
            <tr [class.exceeds]="item.exceedsUncertainty">
              <th scope="row" class="reaction">
                @if (item.label) {
                  <span class="label">{{ item.label }}</span>
                }
                <span class="equation">{{ item.input | chemText }}</span>
                <span class="temperature">{{ item.temperatureK }} K</span>
              </th>
              <td class="num">{{ side(item.from) }}</td>
              <td class="num">{{ side(item.to) }}</td>
              <td class="num change">
                @if (item.change !== null) {
                  {{ value(item.change) }}
                  @if (item.exceedsUncertainty) {
                    <mat-icon class="flag" aria-hidden="false" aria-label="exceeds the uncertainty"
                      >priority_high</mat-icon
                    >
                  }
                } @else {
                  —
                }
              </td>
              <td class="num">
                {{
                  item.combinedUncertainty === null ? 'not stated' : value(item.combinedUncertainty)
                }}
              </td>
            </tr>
          }
        </tbody>
      </table>
    </div>
    <p class="caution">{{ r.caution }}</p>
  `,
  styleUrl: './impact-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ImpactTable {
  readonly report = input.required<ImpactAnswer>();

  protected value(n: number): string {
    return minus(formatValue(n));
  }

  protected side(s: ImpactSide): string {
    return 'error' in s ? s.error.message : this.value(s.deltaH);
  }
}
