import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';

/** Any address the app does not know: said plainly, instead of a silent redirect home. */
@Component({
  selector: 'thalpos-not-found-page',
  imports: [MatButton, MatIcon, RouterLink],
  template: `
    <section class="missing" aria-labelledby="not-found-title">
      <mat-icon class="mark" aria-hidden="true">travel_explore</mat-icon>
      <h1 id="not-found-title">Page not found</h1>
      <p>
        There is no page at <code>{{ path }}</code>. The link may be mistyped, or the page may have
        moved.
      </p>
      <div class="actions">
        <a matButton="filled" routerLink="/">Go to Home</a>
        <a matButton routerLink="/calculate">Calculate</a>
      </div>
    </section>
  `,
  styles: `
    .missing {
      max-width: 40rem;
      margin: 32px auto;
      text-align: center;
    }
    .mark {
      width: 48px;
      height: 48px;
      font-size: 48px;
      color: var(--mat-sys-primary);
    }
    h1 {
      font: var(--mat-sys-headline-medium);
    }
    code {
      overflow-wrap: anywhere;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      justify-content: center;
      gap: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFoundPage {
  protected readonly path = inject(Router).url.split('?')[0];
}
