import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { map, Observable } from 'rxjs';

import type { Role } from '../../core/models/user';
import type { RoleChange, UpdatedUser, UserList, UserRecord } from './models/user-record';

/** Users and roles (admins only). */
@Injectable({ providedIn: 'root' })
export class AdminApi {
  private readonly http = inject(HttpClient);

  listUsers(): Observable<UserRecord[]> {
    return this.http.get<UserList>('/api/v1/users').pipe(map((body) => body.users));
  }

  changeRole(id: number, role: Role): Observable<UserRecord> {
    const body: RoleChange = { role };
    return this.http
      .patch<UpdatedUser>(`/api/v1/users/${encodeURIComponent(id)}`, body)
      .pipe(map((answer) => answer.user));
  }
}
