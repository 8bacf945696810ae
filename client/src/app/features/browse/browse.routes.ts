import { Routes } from '@angular/router';

/** Mounted under `/browse`; public. */
export const BROWSE_ROUTES: Routes = [
  {
    path: '',
    title: 'Browse · Thalpos',
    loadComponent: () => import('./browse-page/browse-page').then((m) => m.BrowsePage),
  },
];
