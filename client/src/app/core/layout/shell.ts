import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatChip, MatChipSet } from '@angular/material/chips';
import { MatIcon } from '@angular/material/icon';
import { MatMenu, MatMenuItem, MatMenuTrigger } from '@angular/material/menu';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTabLink, MatTabNav, MatTabNavPanel } from '@angular/material/tabs';
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

interface SubNav {
  label: string;
  items: readonly { path: string; label: string }[];
  match: IsActiveMatchOptions;
}

const CALCULATE: SubNav = {
  label: 'Calculate',
  items: [
    { path: '/calculate/reaction', label: 'Reaction enthalpy' },
    { path: '/calculate/hess', label: 'Hess combination' },
  ],
  match: { paths: 'subset', queryParams: 'ignored', matrixParams: 'ignored', fragment: 'ignored' },
};

/** Exact paths: a proposal's own page (under /curation/proposals) is not "My proposals". */
const CURATION: SubNav = {
  label: 'Curation',
  items: [
    { path: '/curation/propose', label: 'Propose' },
    { path: '/proposals/upload', label: 'Bulk upload' },
    { path: '/curation/proposals', label: 'My proposals' },
    { path: '/curation/review', label: 'Review' },
  ],
  match: { paths: 'exact', queryParams: 'ignored', matrixParams: 'ignored', fragment: 'ignored' },
};

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
    MatTabNavPanel,
    NgTemplateOutlet,
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
  protected readonly canCurate = computed(() => this.session.hasRole('curator', 'editor', 'admin'));
  /**
   * The second row of tabs, one per screen of a section: the calculation screens for everyone,
   * curation by role (proposing for curators and up, the review queue for editors).
   */
  protected readonly subNav = computed((): SubNav | null => {
    const url = this.url();
    if (url.startsWith('/calculate')) return CALCULATE;
    if (!url.startsWith('/curation') && !url.startsWith('/proposals/upload')) return null;
    if (!this.canCurate()) return null;
    if (this.session.hasRole('editor', 'admin')) return CURATION;
    return { ...CURATION, items: CURATION.items.filter((i) => i.path !== '/curation/review') };
  });

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
