import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

import type { SpeciesPage } from '@contracts/species/species-schemas';
import { phaseName } from '../../../../shared/phase-name';
import { basisWords, kjFromJoulesText, kjUncertainty } from '../../species-format';

type Revision = SpeciesPage['revisions'][number];
type Source = SpeciesPage['sources'][number];

const KIND_WORDS: Readonly<Record<string, string>> = {
  formation_enthalpy: 'ΔfH° (298.15 K)',
  heat_capacity: 'Heat capacity',
  transition: 'Phase transition',
};

/** Every revision of every value of the species, newest first, with what it superseded. */
@Component({
  selector: 'thalpos-revision-history',
  template: `
    <section class="card" aria-labelledby="history-title">
      <h2 id="history-title">Revision history</h2>
      <div class="table-scroll">
        <table class="history" aria-label="Revision history">
          <thead>
            <tr>
              <th scope="col">Revision</th>
              <th scope="col">Quantity</th>
              <th scope="col">Value</th>
              <th scope="col">Status</th>
              <th scope="col">Source</th>
            </tr>
          </thead>
          <tbody>
            @for (row of rows(); track row.id) {
              <tr>
                <td>
                  #{{ row.id }}
                  <span class="sub">{{ row.created }}</span>
                  @if (row.supersedes) {
                    <span class="sub">supersedes #{{ row.supersedes }}</span>
                  }
                </td>
                <td>
                  {{ row.kind }} <span class="sub">{{ row.phase }}</span>
                </td>
                <td>
                  {{ row.value }}
                  @if (row.detail) {
                    <span class="sub">{{ row.detail }}</span>
                  }
                </td>
                <td>
                  {{ row.status }}
                  @if (row.releases) {
                    <span class="sub">in {{ row.releases }}</span>
                  }
                </td>
                <td class="source">
                  {{ row.citation }}
                  @if (row.fromMemory) {
                    <span class="sub">transcribed from memory</span>
                  }
                </td>
              </tr>
            }
          </tbody>
        </table>
      </div>
    </section>
  `,
  styles: `
    .card {
      padding: 20px;
      border-radius: var(--mat-sys-corner-large);
      background: var(--mat-sys-surface-container-low);
      border: 1px solid var(--mat-sys-outline-variant);
    }
    h2 {
      font: var(--mat-sys-title-medium);
      margin: 0 0 12px;
    }
    .table-scroll {
      overflow-x: auto;
    }
    .history {
      width: 100%;
      min-width: 40rem;
      border-collapse: collapse;
      font: var(--mat-sys-body-medium);
    }
    th,
    td {
      padding: 8px;
      text-align: left;
      vertical-align: top;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    th {
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
    .sub {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .source {
      font: var(--mat-sys-body-small);
      max-width: 20rem;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionHistory {
  readonly revisions = input.required<readonly Revision[]>();
  readonly sources = input.required<readonly Source[]>();

  protected readonly rows = computed(() => {
    const citations = new Map(this.sources().map((s) => [s.id, s.citation]));
    return [...this.revisions()]
      .sort((a, b) => b.createdAt.localeCompare(a.createdAt) || b.id - a.id)
      .map((r) => ({
        id: r.id,
        created: r.createdAt.slice(0, 10),
        supersedes: r.supersedesId,
        kind: KIND_WORDS[r.kind] ?? r.kind,
        phase: phaseName(r.phase, r.modification),
        value: valueText(r),
        detail: detailText(r),
        status: r.status,
        releases: r.releases.join(', '),
        citation: citations.get(r.sourceId) ?? `source #${r.sourceId}`,
        fromMemory: r.fromMemory,
      }));
  });
}

function valueText(r: Revision): string {
  if (r.heatCapacity) {
    const form = r.heatCapacity.form === 'nasa7' ? 'NASA 7-coefficient' : 'Shomate';
    const ranges = r.heatCapacity.ranges.map((range) => `${range.tMin}–${range.tMax} K`);
    return `${form}, ${ranges.join(', ')}`;
  }
  if (r.valueText === null) return '—';
  const spread = kjUncertainty(r.uncertainty);
  return `${kjFromJoulesText(r.valueText)}${spread ? ` ± ${spread}` : ''} kJ/mol`;
}

function detailText(r: Revision): string {
  const parts: string[] = [];
  if (r.kind === 'transition' && r.toPhase) {
    parts.push(`to ${phaseName(r.toPhase, r.toModification)} at ${r.temperature} K`);
  }
  if (r.uncertainty !== null) parts.push(basisWords(r.uncertaintyBasis));
  if (r.method) parts.push(r.method);
  parts.push(r.standardPressure);
  return parts.join(' · ');
}
