import { HttpClient } from '@angular/common/http';
import { inject, Injectable } from '@angular/core';
import { Observable } from 'rxjs';

import type { SettingsAnswer, SettingsPatch } from '@contracts/users/users-schemas';

/** The signed-in user's own settings. */
@Injectable({ providedIn: 'root' })
export class SettingsApi {
  private readonly http = inject(HttpClient);

  read(): Observable<SettingsAnswer> {
    return this.http.get<SettingsAnswer>('/api/v1/me/settings');
  }

  update(patch: SettingsPatch): Observable<SettingsAnswer> {
    return this.http.patch<SettingsAnswer>('/api/v1/me/settings', patch);
  }
}
