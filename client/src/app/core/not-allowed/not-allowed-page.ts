import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { ROLES, type Role } from '../models/user';
import { Session, SIGN_IN_URL } from '../session';

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
  protected readonly signInUrl = SIGN_IN_URL;

  /** Query parameter `needs`: the roles the refused page requires, comma-separated. */
  readonly needs = input<string | undefined>();

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
