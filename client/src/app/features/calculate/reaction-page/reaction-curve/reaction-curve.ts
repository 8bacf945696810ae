import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatProgressBar } from '@angular/material/progress-bar';
import type { ChartConfiguration } from 'chart.js';
import { BaseChartDirective, provideCharts, withDefaultRegisterables } from 'ng2-charts';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import { ApiError, rateLimitMessage, readableMessage } from '../../../../core/api-error';
import { formatValue } from '../../../../shared/energy-unit';
import { ReactionApi } from '../reaction-api';
import type { ReactionQuery } from '../reaction-query';
import { coveredRun, sweepTemperatures, type SweepPoint } from '../temperature-sweep';

/** Palette tones (ember 50, slate teal 40): chart.js paints on a canvas and reads no CSS. */
const LINE_COLOUR = '#c2572b';
const MARK_COLOUR = '#366570';

type Curve =
  | { readonly state: 'loading' }
  | { readonly state: 'drawn'; readonly points: readonly SweepPoint[] }
  | { readonly state: 'none'; readonly message: string };

/**
 * ΔrH(T) over the temperatures the release's heat-capacity data cover: one batch request on a
 * 100 K grid; the grid points the API refuses mark where the data end.
 */
@Component({
  selector: 'thalpos-reaction-curve',
  imports: [BaseChartDirective, MatProgressBar],
  providers: [provideCharts(withDefaultRegisterables())],
  template: `
    <h3>ΔrH over temperature</h3>
    @let c = curve();
    @switch (c.state) {
      @case ('loading') {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the curve" />
      }
      @case ('drawn') {
        <p class="range">{{ summary() }}</p>
        <div class="plot">
          <canvas
            baseChart
            type="line"
            [data]="chartData()"
            [options]="options()"
            role="img"
            [attr.aria-label]="summary()"
          ></canvas>
        </div>
      }
      @case ('none') {
        <p class="range">{{ c.message }}</p>
      }
    }
  `,
  styles: `
    :host {
      display: block;
      padding: 20px;
      border-radius: var(--mat-sys-corner-large);
      background: var(--mat-sys-surface-container-low);
      border: 1px solid var(--mat-sys-outline-variant);
    }
    h3 {
      font: var(--mat-sys-title-medium);
      margin: 0 0 4px;
    }
    .range {
      margin: 0 0 8px;
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-medium);
    }
    .plot {
      position: relative;
      height: 280px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReactionCurve {
  private readonly api = inject(ReactionApi);

  readonly query = input.required<ReactionQuery>();

  protected readonly curve = toSignal(
    toObservable(this.query).pipe(
      switchMap((query) => {
        const temperatures = sweepTemperatures(query.temperatureK);
        return this.api
          .batch({
            release: query.release,
            unit: query.unit,
            reactions: temperatures.map((temperatureK) => ({
              equation: query.equation,
              temperatureK,
            })),
          })
          .pipe(
            map((answer): Curve => {
              const points = answer.results.map((item, i) => ({
                temperatureK: temperatures[i],
                deltaH: 'deltaH' in item ? item.deltaH : null,
              }));
              const run = coveredRun(points, query.temperatureK);
              return run.length > 1
                ? { state: 'drawn', points: run }
                : {
                    state: 'none',
                    message:
                      'This release holds no heat-capacity data for every term, so ΔrH is known at this temperature only.',
                  };
            }),
            catchError((error: unknown) =>
              of<Curve>({
                state: 'none',
                message:
                  error instanceof ApiError && error.rateLimited
                    ? `The curve is not drawn now. ${rateLimitMessage(error.retryAfter)}`
                    : `The curve could not be drawn: ${readableMessage(error)}`,
              }),
            ),
            startWith<Curve>({ state: 'loading' }),
          );
      }),
    ),
    { initialValue: { state: 'loading' } as Curve },
  );

  private readonly points = computed(() => {
    const curve = this.curve();
    return curve.state === 'drawn' ? curve.points : [];
  });

  protected readonly summary = computed(() => {
    const points = this.points();
    if (points.length === 0) return '';
    const first = points[0];
    const last = points[points.length - 1];
    const unit = this.query().unit;
    return (
      `From ${first.temperatureK} K to ${last.temperatureK} K, the range this release's data ` +
      `cover: ΔrH goes from ${formatValue(first.deltaH ?? 0)} to ${formatValue(last.deltaH ?? 0)} ${unit}.`
    );
  });

  protected readonly chartData = computed<ChartConfiguration<'line'>['data']>(() => {
    const query = this.query();
    const points = this.points().map((p) => ({ x: p.temperatureK, y: p.deltaH ?? 0 }));
    const chosen = points.filter((p) => p.x === query.temperatureK);
    return {
      datasets: [
        {
          label: `ΔrH (${query.unit})`,
          data: points,
          borderColor: LINE_COLOUR,
          backgroundColor: LINE_COLOUR,
          pointRadius: 0,
          borderWidth: 2,
          tension: 0,
        },
        {
          label: `At ${query.temperatureK} K`,
          data: chosen,
          borderColor: MARK_COLOUR,
          backgroundColor: MARK_COLOUR,
          pointRadius: 5,
          showLine: false,
        },
      ],
    };
  });

  protected readonly options = computed<ChartConfiguration<'line'>['options']>(() => ({
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    parsing: false,
    scales: {
      x: { type: 'linear', title: { display: true, text: 'Temperature (K)' } },
      y: { title: { display: true, text: `ΔrH (${this.query().unit})` } },
    },
    plugins: { legend: { position: 'bottom' } },
  }));
}
