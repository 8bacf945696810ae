import { Routes } from '@angular/router';

/** Mounted under `/calculate`; public. */
export const CALCULATE_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'hess' },
  {
    path: 'hess',
    title: 'Hess combination · Thalpos',
    loadComponent: () => import('./hess-page/hess-page').then((m) => m.HessPage),
  },
  {
    path: 'reaction',
    title: 'Reaction enthalpy · Thalpos',
    loadComponent: () => import('./reaction-page/reaction-page').then((m) => m.ReactionPage),
  },
];
