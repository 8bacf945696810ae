import { Routes } from '@angular/router';

/**
 * Mounted under `/releases`; public. The list at `''`, the diff of two releases at
 * `:from/diff/:to` (and `diff`, which opens on the newest two); draft screens go beside them.
 */
export const RELEASES_ROUTES: Routes = [
  {
    path: '',
    title: 'Releases · Thalpos',
    loadComponent: () => import('./releases-page/releases-page').then((m) => m.ReleasesPage),
  },
  {
    path: 'diff',
    title: 'Compare releases · Thalpos',
    loadComponent: () => import('./diff-page/diff-page').then((m) => m.DiffPage),
  },
  {
    path: ':from/diff/:to',
    title: 'Compare releases · Thalpos',
    loadComponent: () => import('./diff-page/diff-page').then((m) => m.DiffPage),
  },
];
