import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import {
  MatCell,
  MatCellDef,
  MatColumnDef,
  MatHeaderCell,
  MatHeaderCellDef,
  MatHeaderRow,
  MatHeaderRowDef,
  MatRow,
  MatRowDef,
  MatTable,
} from '@angular/material/table';
import { Router } from '@angular/router';

import { readableMessage } from '../../../core/api-error';
import { ROLES, type Role } from '../../../core/models/user';
import { Session } from '../../../core/session';
import { AdminApi } from '../admin-api';
import type { UserRecord } from '../models/user-record';

/** A user as stored on the server, with the select that edits its role. */
interface UserRow {
  readonly user: UserRecord;
  readonly role: FormControl<Role>;
}

/** Admin → Users: every account and its role; a role change is saved as soon as it is picked. */
@Component({
  selector: 'thalpos-users-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatButton,
    MatIcon,
    MatProgressBar,
    MatSelect,
    MatOption,
    MatTable,
    MatColumnDef,
    MatHeaderCell,
    MatHeaderCellDef,
    MatCell,
    MatCellDef,
    MatHeaderRow,
    MatHeaderRowDef,
    MatRow,
    MatRowDef,
  ],
  templateUrl: './users-page.html',
  styleUrl: './users-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UsersPage {
  private readonly api = inject(AdminApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly roles = ROLES;
  protected readonly columns = ['login', 'name', 'role', 'createdAt'] as const;
  protected readonly rows = signal<readonly UserRow[]>([]);
  protected readonly loading = signal(true);
  protected readonly loadError = signal<string | null>(null);

  protected readonly trackById = (_: number, row: UserRow) => row.user.id;

  constructor() {
    this.load();
  }

  protected load(): void {
    this.loading.set(true);
    this.loadError.set(null);
    this.api
      .listUsers()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (users) => {
          this.rows.set(
            users.map((user) => ({
              user,
              role: new FormControl(user.role, { nonNullable: true }),
            })),
          );
          this.loading.set(false);
        },
        error: (error: unknown) => {
          this.loadError.set(readableMessage(error));
          this.loading.set(false);
        },
      });
  }

  protected changeRole(row: UserRow, role: Role): void {
    const stored = row.user;
    if (role === stored.role) return;
    row.role.disable({ emitEvent: false });
    this.api
      .changeRole(stored.id, role)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (user) => {
          row.role.setValue(user.role, { emitEvent: false });
          row.role.enable({ emitEvent: false });
          this.rows.update((rows) =>
            rows.map((r) => (r.user.id === user.id ? { user, role: r.role } : r)),
          );
          this.snackBar.open(`Role of ${user.login} changed to ${user.role}`, undefined, {
            duration: 5000,
          });
          if (user.id === this.session.user()?.id) void this.afterOwnRoleChange();
        },
        error: (error: unknown) => {
          row.role.setValue(stored.role, { emitEvent: false });
          row.role.enable({ emitEvent: false });
          this.snackBar.open(
            `Role of ${stored.login} not changed: ${readableMessage(error)}`,
            'Dismiss',
            { duration: 10000 },
          );
        },
      });
  }

  /** An admin who gave up the admin role may no longer stay on this page. */
  private async afterOwnRoleChange(): Promise<void> {
    const me = await this.session.refresh();
    if (me?.role !== 'admin') await this.router.navigateByUrl('/');
  }
}
