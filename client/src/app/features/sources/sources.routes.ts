import { Routes } from '@angular/router';

/** Mounted under `/sources`; reading is public, adding needs a curator, editor or admin. */
export const SOURCES_ROUTES: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Sources · Thalpos',
    loadComponent: () => import('./sources-page/sources-page').then((m) => m.SourcesPage),
  },
  {
    path: ':id',
    title: 'Source · Thalpos',
    loadComponent: () => import('./source-page/source-page').then((m) => m.SourcePage),
  },
];
