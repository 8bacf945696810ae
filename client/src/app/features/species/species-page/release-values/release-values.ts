import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective, provideCharts, withDefaultRegisterables } from 'ng2-charts';

import type { SpeciesPage } from '@contracts/species/species-schemas';
import { ChemText } from '../../../../shared/chem-text';
import { phaseLabel, phaseName } from '../../../../shared/phase-name';
import { basisWords, kjFromJoules, kjUncertainty } from '../../species-format';

type PhaseView = SpeciesPage['phases'][number];

/** Palette tones for one line per phase (chart.js paints on a canvas and reads no CSS). */
const PHASE_COLOURS = ['#c2572b', '#366570', '#71594b', '#832700', '#4f7e8a'];

/** ΔfH° of each phase in each published release: a chart and the same numbers as a table. */
@Component({
  selector: 'thalpos-release-values',
  imports: [BaseChartDirective, ChemText],
  providers: [provideCharts(withDefaultRegisterables())],
  template: `
    <section class="card" aria-labelledby="values-title">
      <h2 id="values-title">ΔfH° at 298.15 K in each release</h2>
      @if (releases().length > 0) {
        <div class="plot">
          <canvas
            baseChart
            type="line"
            [data]="chartData()"
            [options]="options"
            role="img"
            [attr.aria-label]="'ΔfH° by release; the same values are in the table below.'"
          ></canvas>
        </div>
        <div class="table-scroll">
          <table class="values" aria-label="ΔfH° by release">
            <thead>
              <tr>
                <th scope="col">Release</th>
                <th scope="col">Phase</th>
                <th scope="col" class="numeric">ΔfH° (kJ/mol)</th>
                <th scope="col" class="numeric">±</th>
                <th scope="col">Revision</th>
              </tr>
            </thead>
            <tbody>
              @for (row of rows(); track row.id) {
                <tr>
                  <td>{{ row.release }}</td>
                  <td>
                    {{ row.phase | chemText }} <span class="sub">{{ row.phaseName }}</span>
                  </td>
                  <td class="numeric">{{ row.value }}</td>
                  <td class="numeric">
                    {{ row.spread ?? '—' }}
                    <span class="sub">{{ row.basis }}</span>
                  </td>
                  <td>#{{ row.revisionId }}</td>
                </tr>
              }
            </tbody>
          </table>
        </div>
      } @else {
        <p class="none">No published release holds a ΔfH° for this species yet.</p>
      }
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
    .plot {
      position: relative;
      height: 240px;
      margin-bottom: 16px;
    }
    .table-scroll {
      overflow-x: auto;
    }
    .values {
      width: 100%;
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
    .numeric {
      text-align: right;
      font-variant-numeric: tabular-nums;
      white-space: nowrap;
    }
    @media (max-width: 599.98px) {
      th,
      td {
        padding: 6px 4px;
      }
      th.numeric {
        white-space: normal;
      }
    }
    .sub {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      // The basis under a number may wrap, so the table fits a phone's width.
      white-space: normal;
    }
    .none {
      margin: 0;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReleaseValues {
  readonly phases = input.required<readonly PhaseView[]>();
  readonly formula = input.required<string>();

  /** Every release that holds a value of any phase, oldest first. */
  protected readonly releases = computed(() => {
    const seen = new Map<string, string>();
    for (const phase of this.phases()) {
      for (const v of phase.formationEnthalpy) seen.set(v.release, v.publishedAt);
    }
    return [...seen.entries()].sort((a, b) => a[1].localeCompare(b[1])).map(([r]) => r);
  });

  protected readonly rows = computed(() =>
    this.releases().flatMap((release) =>
      this.phases().flatMap((phase) =>
        phase.formationEnthalpy
          .filter((v) => v.release === release)
          .map((v) => ({
            id: `${release}/${phase.phase}/${phase.modification ?? ''}`,
            release,
            phase: this.formula() + phaseLabel(phase.phase, phase.modification),
            phaseName: phaseName(phase.phase, phase.modification),
            value: kjFromJoules(v.value),
            spread: kjUncertainty(v.uncertainty),
            basis: basisWords(v.uncertaintyBasis),
            revisionId: v.revisionId,
          })),
      ),
    ),
  );

  protected readonly chartData = computed<ChartConfiguration<'line'>['data']>(() => {
    const releases = this.releases();
    return {
      labels: releases,
      datasets: this.phases().map((phase, i) => ({
        label: `${this.formula()}${phaseLabel(phase.phase, phase.modification)}`,
        data: releases.map((release) => {
          const v = phase.formationEnthalpy.find((x) => x.release === release);
          return v ? v.value / 1000 : null;
        }),
        borderColor: PHASE_COLOURS[i % PHASE_COLOURS.length],
        backgroundColor: PHASE_COLOURS[i % PHASE_COLOURS.length],
        pointRadius: 5,
        spanGaps: false,
      })),
    };
  });

  protected readonly options: ChartConfiguration<'line'>['options'] = {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    scales: {
      x: { title: { display: true, text: 'Release' } },
      y: { title: { display: true, text: 'ΔfH° (kJ/mol)' } },
    },
    plugins: { legend: { position: 'bottom' } },
  };
}
