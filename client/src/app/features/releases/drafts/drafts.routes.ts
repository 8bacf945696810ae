import { Routes } from '@angular/router';

/** Mounted under `/releases/drafts`, behind the editor/admin role guard. */
export const RELEASE_DRAFT_ROUTES: Routes = [
  {
    path: '',
    title: 'Release drafts · Thalpos',
    loadComponent: () => import('./drafts-page/drafts-page').then((m) => m.DraftsPage),
  },
  {
    path: ':version',
    title: 'Release draft · Thalpos',
    loadComponent: () => import('./draft-page/draft-page').then((m) => m.DraftPage),
  },
];
