import { Clipboard } from '@angular/cdk/clipboard';
import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
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
import { RouterLink } from '@angular/router';

import type { ReactionEnthalpyAnswer } from '@contracts/reactions/reactions-schemas';
import { ChemText } from '../../../../shared/chem-text';
import { formatFactor } from '../../../../shared/energy-unit';
import { phaseName } from '../../../../shared/phase-name';
import { curlCommand, type ReactionQuery, STANDARD_TEMPERATURE_K } from '../reaction-query';

/** One row of the breakdown, already in the words and numbers the table shows. */
interface TermRow {
  /** Registry key for the link to the species; null for an unlisted reference element. */
  readonly key: string | null;
  readonly formula: string;
  readonly phase: string;
  readonly side: 'reactant' | 'product';
  readonly coefficient: string;
  readonly deltaFH: string;
  readonly increment: string;
  readonly revision: string | null;
  readonly citation: string | null;
  readonly doi: string | null;
  /** Where the heat-capacity data behind the increment come from, at T ≠ 298.15 K. */
  readonly heatCapacity: string | null;
  readonly notes: readonly string[];
}

const spreadFormat = new Intl.NumberFormat('en-US', {
  maximumSignificantDigits: 2,
  useGrouping: false,
});

/**
 * An energy in the answer's unit at one precision for the whole card (2 decimals, whole J/mol),
 * so trailing zeros stay (`18.00`), with a real minus sign and never `−0.00`.
 */
export function energyText(value: number, unit: string): string {
  const decimals = unit === 'J/mol' ? 0 : 2;
  const text = (Math.abs(value) < 0.5 * 10 ** -decimals ? 0 : value).toFixed(decimals);
  return text.startsWith('-') ? `\u2212${text.slice(1)}` : text;
}

/** `−802.29 ± 0.42 kJ/mol`; the ± to two significant digits, left out when unknown. */
export function energyWithSpread(value: number, unit: string, spread: number | null): string {
  const plusMinus = spread === null ? '' : ` ± ${spreadFormat.format(spread)}`;
  return `${energyText(value, unit)}${plusMinus} ${unit}`;
}

/** What each uncertainty basis code means, in the words the result card uses. */
const BASIS_WORDS: Readonly<Record<string, string>> = {
  standard: 'standard uncertainties',
  expanded_k2: 'expanded uncertainties (k = 2)',
  as_stated: 'uncertainties as their sources state them',
  mixed: 'uncertainties of mixed kinds (standard and expanded)',
};

/** How the total's ± came about, or why there is none. */
export function uncertaintyWords(answer: ReactionEnthalpyAnswer): string {
  const { uncertaintyBasis: basis, uncertainty } = answer;
  if (basis === 'exact') return 'Exact: every term is an element in its reference state.';
  if (uncertainty === null || basis === 'unavailable') {
    const missing = answer.terms
      .filter((term) => term.uncertainty === null && !term.referenceState)
      .map((term) => term.formula);
    return missing.length > 0
      ? `Uncertainty not combined: no uncertainty recorded for ${missing.join(', ')}.`
      : 'Uncertainty not combined.';
  }
  const words = BASIS_WORDS[basis] ?? basis;
  return `± from ${words}, combined as the root sum of squares of independent terms.`;
}

/** The result card: ΔrH, the term-by-term breakdown with each term's provenance, assumptions. */
@Component({
  selector: 'thalpos-reaction-result',
  imports: [
    MatButton,
    MatIcon,
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
    RouterLink,
    ChemText,
  ],
  templateUrl: './reaction-result.html',
  styleUrl: './reaction-result.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReactionResult {
  private readonly clipboard = inject(Clipboard);
  private readonly snackBar = inject(MatSnackBar);
  private readonly document = inject(DOCUMENT);

  readonly answer = input.required<ReactionEnthalpyAnswer>();
  /** The inputs the answer was computed from (for the link and the command). */
  readonly query = input.required<ReactionQuery>();

  protected readonly standard = computed(
    () => this.answer().temperatureK === STANDARD_TEMPERATURE_K,
  );

  protected readonly columns = computed(() =>
    this.standard()
      ? ['term', 'coefficient', 'deltaFH', 'source']
      : ['term', 'coefficient', 'deltaFH', 'increment', 'source'],
  );

  protected readonly total = computed(() => {
    const answer = this.answer();
    return energyWithSpread(answer.deltaH, answer.unit, answer.uncertainty);
  });

  protected readonly standardTotal = computed(() => {
    const answer = this.answer();
    return answer.deltaH298 === undefined
      ? ''
      : `${energyText(answer.deltaH298, answer.unit)} ${answer.unit}`;
  });

  protected readonly character = computed(() => {
    const deltaH = this.answer().deltaH;
    if (deltaH < 0) return 'exothermic';
    if (deltaH > 0) return 'endothermic';
    return 'thermoneutral';
  });

  protected readonly uncertaintyText = computed(() => uncertaintyWords(this.answer()));

  protected readonly rows = computed<TermRow[]>(() => {
    const unit = this.answer().unit;
    return this.answer().terms.map((term) => ({
      key: term.species,
      formula: term.formula,
      phase: phaseName(term.phase, term.modification),
      side: term.coefficient < 0 ? 'reactant' : 'product',
      coefficient: formatFactor(term.coefficient),
      deltaFH: energyWithSpread(term.deltaFH, unit, term.uncertainty),
      increment:
        term.enthalpyIncrement === undefined ? '' : energyText(term.enthalpyIncrement, unit),
      revision: term.revisionId,
      citation: term.source?.citation ?? null,
      doi: term.source?.doi ?? null,
      heatCapacity: term.heatCapacity
        ? `Heat capacity: revision ${term.heatCapacity.revisionId}, ${term.heatCapacity.source.citation}`
        : null,
      notes: [
        ...(term.note ? [term.note] : []),
        ...(term.transitions ?? []).map(
          (t) =>
            `Crosses a transition at ${t.temperature} K${t.phase ? ` to ${phaseName(t.phase)}` : ''} ` +
            `(ΔtrsH ${energyText(t.deltaH, unit)} ${unit}).`,
        ),
      ],
    }));
  });

  protected copyCurl(): void {
    const command = curlCommand(this.document.location.origin, this.query());
    this.copied(this.clipboard.copy(command), 'Command copied.');
  }

  protected copyLink(): void {
    this.copied(this.clipboard.copy(this.document.location.href), 'Link copied.');
  }

  private copied(ok: boolean, message: string): void {
    this.snackBar.open(ok ? message : 'Copying failed; select the text instead.', undefined, {
      duration: 3000,
    });
  }
}
