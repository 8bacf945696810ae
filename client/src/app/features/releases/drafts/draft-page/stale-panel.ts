import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';

import type { StaleDerived } from '@contracts/releases/release-drafts-schemas';
import { ChemText } from '../../../../shared/chem-text';
import { phaseLabel } from '../../../../shared/phase-name';

/**
 * Derived values that the draft would publish stale (an input they were computed from is
 * replaced or retired by an included change). Each needs its re-derivation included in the
 * draft, or the editor's acknowledgement, before the draft can be published.
 */
@Component({
  selector: 'thalpos-stale-panel',
  imports: [ChemText, MatButton, MatIcon],
  template: `
    <section class="stale" aria-labelledby="stale-title">
      <h2 id="stale-title">
        <mat-icon aria-hidden="true">warning</mat-icon>
        Stale derived values ({{ stale().length }})
      </h2>
      <p>
        These values were derived from inputs this draft replaces. Include their re-derivation (a
        proposal that derives them again), or acknowledge that they are published as they are.
      </p>
      <ul>
        @for (s of stale(); track s.revisionId) {
          <li [class.done]="s.acknowledged">
            <span class="what">
              {{ s.species.name }} {{ s.species.formula + label(s) | chemText }} (revision
              {{ s.revisionId }})
            </span>
            <span class="inputs">
              from
              @for (i of s.inputs; track i.revisionId; let last = $last) {
                {{ i.speciesKey }} revision {{ i.revisionId }}
                {{ i.replacedBy ? '→ ' + i.replacedBy : '(retired)' }}{{ last ? '' : ',' }}
              }
            </span>
            @if (s.acknowledged) {
              <span class="acked"><mat-icon aria-hidden="true">check</mat-icon> Acknowledged</span>
            } @else {
              <button
                matButton="outlined"
                type="button"
                [disabled]="busy()"
                (click)="acknowledge.emit([s.revisionId])"
              >
                Acknowledge
              </button>
            }
          </li>
        }
      </ul>
    </section>
  `,
  styleUrl: './stale-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StalePanel {
  readonly stale = input.required<readonly StaleDerived[]>();
  readonly busy = input(false);
  readonly acknowledge = output<number[]>();

  protected label(s: StaleDerived): string {
    return phaseLabel(s.phase, s.modification);
  }
}
