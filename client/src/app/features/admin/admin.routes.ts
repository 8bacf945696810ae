import { Routes } from '@angular/router';

/** Mounted under `/admin`, behind `roleGuard('admin')`. */
export const ADMIN_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'users' },
  {
    path: 'users',
    title: 'Users · Admin · Thalpos',
    loadComponent: () => import('./users-page/users-page').then((m) => m.UsersPage),
  },
];
