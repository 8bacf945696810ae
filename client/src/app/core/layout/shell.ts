import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatChip, MatChipSet } from '@angular/material/chips';
import { MatIcon } from '@angular/material/icon';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTabLink, MatTabNav } from '@angular/material/tabs';
import { MatToolbar } from '@angular/material/toolbar';
import {
  NavigationEnd,
  Router,
  RouterLink,
  RouterLinkActive,
  type IsActiveMatchOptions,
} from '@angular/router';
import { filter, map, startWith } from 'rxjs';

import { readableMessage } from '../api-error';
import { Session, signInHref } from '../session';

/** Top bar (product name, navigation, who is signed in) around the routed screen. */
@Component({
  selector: 'thalpos-shell',
  imports: [
    MatToolbar,
    MatButton,
    MatIconButton,
    MatMenu,
    MatMenuItem,
    MatMenuTrigger,
    MatIcon,
    MatChipSet,
    MatChip,
    MatTabNav,
    MatTabLink,
    RouterLink,
    RouterLinkActive,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  protected readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly signingOut = signal(false);

  protected readonly calculateItems = [
    { path: '/calculate/reaction', label: 'Reaction enthalpy' },
    { path: '/calculate/hess', label: 'Hess combination' },
  ] as const;

  protected readonly exactPath: IsActiveMatchOptions = {
    paths: 'exact',
    queryParams: 'ignored',
    matrixParams: 'ignored',
    fragment: 'ignored',
  };

  /** Curation links by role: proposing for curators and up, the review queue for editors. */
  protected readonly curationItems = computed(() => {
    const items: { path: string; label: string }[] = [];
    if (!this.session.hasRole('curator', 'editor', 'admin')) return items;
    items.push(
      { path: '/curation/propose', label: 'Propose' },
      { path: '/proposals/upload', label: 'Bulk upload' },
      { path: '/curation/proposals', label: 'My proposals' },
    );
    if (this.session.hasRole('editor', 'admin')) {
      items.push({ path: '/curation/review', label: 'Review' });
    }
    return items;
  });

  private readonly url = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      startWith(null),
      map(() => this.router.url),
    ),
    { initialValue: this.router.url },
  );
  /** Sign-in comes back to this page with its query (a calculation kept in the URL survives). */
  protected readonly signInUrl = computed(() => signInHref(this.url()));
  /** The calculation screens get a second row of links, one per screen. */
  protected readonly inCalculate = computed(() => this.url().startsWith('/calculate'));
  protected readonly inCuration = computed(
    () => this.url().startsWith('/curation') || this.url().startsWith('/proposals/upload'),
  );

  protected async signOut(): Promise<void> {
    this.signingOut.set(true);
    try {
      await this.session.signOut();
      await this.router.navigateByUrl('/');
    } catch (error) {
      this.snackBar.open(`Sign-out failed: ${readableMessage(error)}`, 'Dismiss', {
        duration: 8000,
      });
    } finally {
      this.signingOut.set(false);
    }
  }
}
