import { Routes } from '@angular/router';

/** Mounted under `/integrate`, for signed-in users. */
export const INTEGRATE_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Integrate · Thalpos',
    loadComponent: () => import('./integrate-page/integrate-page').then((m) => m.IntegratePage),
  },
];
