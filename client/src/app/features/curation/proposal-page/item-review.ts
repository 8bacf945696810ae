import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { catchError, map, of, switchMap } from 'rxjs';

import type { ProposalItemView, RevisionRef } from '@contracts/proposals/proposals-schemas';
import type { DocumentView } from '@contracts/sources/sources-schemas';
import { ChemText } from '../../../shared/chem-text';
import { phaseName } from '../../../shared/phase-name';
import {
  basisWords,
  kjFromJoules,
  kjFromJoulesText,
  kjUncertainty,
} from '../../species/species-format';
import { SourcesApi } from '../../../shared/sources-api';
import { KIND_WORDS } from '../proposal-status';

const signed = new Intl.NumberFormat('en-US', {
  maximumFractionDigits: 2,
  signDisplay: 'exceptZero',
  useGrouping: false,
});
const ratio = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1, useGrouping: false });

/** A number with a real minus sign. */
const minus = (text: string) => text.replace('-', '−');

/**
 * One item for review: the proposed value beside the value it would replace, how far apart they
 * are (in kJ/mol and in combined uncertainties, flagged in words above 2), the other values on
 * record, the source and its documents, and what approving would touch.
 */
@Component({
  selector: 'thalpos-item-review',
  imports: [RouterLink, MatIcon, ChemText],
  templateUrl: './item-review.html',
  styleUrls: ['./item-review.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ItemReview {
  private readonly sources = inject(SourcesApi);

  readonly item = input.required<ProposalItemView>();

  protected readonly kindWords = KIND_WORDS;
  protected readonly phaseName = phaseName;
  protected readonly basisWords = basisWords;

  protected readonly documents = toSignal(
    toObservable(this.item).pipe(
      map((item) => item.source?.id ?? null),
      switchMap((sourceId) =>
        sourceId === null
          ? of<DocumentView[]>([])
          : this.sources.documents(String(sourceId)).pipe(
              map((list) => list.documents),
              catchError(() => of<DocumentView[]>([])),
            ),
      ),
    ),
    { initialValue: [] as DocumentView[] },
  );
  protected documentHref(sourceId: number, documentId: string): string {
    return this.sources.documentUrl(String(sourceId), documentId);
  }

  /** The proposal's own value, as the curator typed it and as stored (kJ/mol). */
  protected readonly proposed = computed(() => {
    const item = this.item();
    const input = item.input;
    const typed =
      typeof input['value'] === 'number'
        ? `${minus(String(input['value']))} ${String(input['unit'] ?? '')}`
        : typeof input['deltaH'] === 'number'
          ? `ΔrH° ${minus(String(input['deltaH']))} ${String(input['unit'] ?? '')}`
          : null;
    const value = item.derivation?.value ?? item.value;
    const uncertainty = item.derivation?.uncertainty ?? item.uncertainty;
    return {
      typed,
      kj: value === null ? null : kjFromJoules(value),
      spread: kjUncertainty(uncertainty),
      basis: typeof input['uncertaintyBasis'] === 'string' ? input['uncertaintyBasis'] : null,
      method: typeof input['method'] === 'string' ? input['method'] : null,
    };
  });

  protected readonly comparison = computed(() => {
    const c = this.item().comparison;
    if (!c) return null;
    return {
      ...c,
      difference: minus(signed.format(c.differenceKJPerMol)),
      combined:
        c.combinedUncertaintyKJPerMol === null ? null : ratio.format(c.combinedUncertaintyKJPerMol),
      times:
        c.differenceInUncertainties === null ? null : ratio.format(c.differenceInUncertainties),
    };
  });

  protected revisionValue(r: RevisionRef): string {
    if (r.valueText !== null) return kjFromJoulesText(r.valueText);
    return r.value === null ? '—' : kjFromJoules(r.value);
  }
  protected spread(r: RevisionRef): string | null {
    return kjUncertainty(r.uncertainty);
  }
  protected sizeText(bytes: number): string {
    if (bytes < 1024) return `${bytes} bytes`;
    if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`;
    return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
  }

  protected kj(value: number | null): string {
    return value === null ? '—' : minus(signed.format(value).replace('+', ''));
  }
}
