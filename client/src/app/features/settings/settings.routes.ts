import { Routes } from '@angular/router';

/** Mounted under `/settings`, for every signed-in user. */
export const SETTINGS_ROUTES: Routes = [
  {
    path: '',
    title: 'Settings · Thalpos',
    loadComponent: () => import('./settings-page/settings-page').then((m) => m.SettingsPage),
  },
];
