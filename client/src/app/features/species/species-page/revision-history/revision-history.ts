import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { Router } from '@angular/router';

import type { SpeciesPage } from '@contracts/species/species-schemas';
import { readableMessage } from '../../../../core/api-error';
import { Session } from '../../../../core/session';
import { SpeciesApi } from '../../species-api';
import { phaseName } from '../../../../shared/phase-name';
import { basisWords, kjFromJoulesText, kjUncertainty, staleWords } from '../../species-format';

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
  imports: [MatButton],
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
                  @if (row.derived) {
                    <span class="derived">Derived</span>
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
                  @for (notice of row.staleNotices; track notice) {
                    <span class="stale" role="note">{{ notice }}</span>
                  }
                  @if (row.derived && mayRederive()) {
                    <button
                      mat-stroked-button
                      type="button"
                      class="rederive"
                      [disabled]="busy() !== null"
                      (click)="rederive(row.id)"
                    >
                      Re-derive
                    </button>
                    @if (failures()[row.id]; as failure) {
                      <span class="problem" role="alert">{{ failure }}</span>
                    }
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
    .derived {
      display: inline-block;
      margin-top: 4px;
      padding: 0 6px;
      border: 1px solid var(--mat-sys-outline);
      border-radius: var(--mat-sys-corner-small);
      font: var(--mat-sys-label-small);
    }
    .stale,
    .problem {
      display: block;
      margin-top: 4px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-error);
    }
    .rederive {
      margin-top: 4px;
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

  private readonly api = inject(SpeciesApi);
  private readonly router = inject(Router);
  private readonly session = inject(Session);

  protected readonly mayRederive = computed(() =>
    this.session.hasRole('curator', 'editor', 'admin'),
  );
  /** The revision whose re-derivation is under way, if any. */
  protected readonly busy = signal<number | null>(null);
  /** The server's refusal per revision id. */
  protected readonly failures = signal<Readonly<Record<number, string>>>({});

  protected rederive(id: number): void {
    this.busy.set(id);
    this.failures.update(({ [id]: _, ...rest }) => rest);
    this.api.rederive(id).subscribe({
      next: (answer) => {
        this.busy.set(null);
        void this.router.navigate(['/curation/proposals', answer.id, 'edit']);
      },
      error: (error: unknown) => {
        this.busy.set(null);
        this.failures.update((f) => ({ ...f, [id]: readableMessage(error) }));
      },
    });
  }

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
        derived: r.derived === true,
        staleNotices: r.stale ? staleWords(r.staleInputs) : [],
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
