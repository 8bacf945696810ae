import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { Router, RouterLink } from '@angular/router';

import { ROLES, type Role } from '../models/user';
import { Session, signInHref } from '../session';

/** Where the role guard sends people who may not open a page. */
@Component({
  selector: 'thalpos-not-allowed-page',
  imports: [MatButton, MatIcon, RouterLink],
  templateUrl: './not-allowed-page.html',
  styleUrl: './not-allowed-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotAllowedPage {
  protected readonly session = inject(Session);
  private readonly router = inject(Router);
  /** Query parameter `needs`: the roles the refused page requires, comma-separated. */
  readonly needs = input<string | undefined>();
  /** Query parameter `unavailable`: the session could not be read, so nothing was refused. */
  readonly unavailable = input<string | undefined>();
  /** Query parameter `from`: the page that was asked for. */
  readonly from = input<string | undefined>();

  protected readonly sessionUnknown = computed(
    () => this.unavailable() !== undefined && this.session.user() === null,
  );
  /** Back to the page asked for, same-site paths only. */
  protected readonly retryUrl = computed(() => {
    const from = this.from() ?? '/';
    return from.startsWith('/') && !from.startsWith('//') ? from : '/';
  });
  protected readonly signInUrl = computed(() => signInHref(this.from()));

  protected async retry(): Promise<void> {
    await this.session.refresh();
    await this.router.navigateByUrl(this.retryUrl());
  }

  protected readonly neededRoles = computed(() =>
    (this.needs() ?? '')
      .split(',')
      .map((role) => role.trim())
      .filter((role): role is Role => (ROLES as readonly string[]).includes(role)),
  );

  protected readonly neededText = computed(() => {
    const roles = this.neededRoles();
    if (roles.length === 0) return 'a role you do not have';
    return `the ${roles.join(' or ')} role`;
  });
}
