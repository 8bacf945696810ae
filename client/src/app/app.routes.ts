import { Routes } from '@angular/router';

import { roleGuard } from './core/auth-guard';

export const routes: Routes = [
  {
    path: '',
    pathMatch: 'full',
    title: 'Thalpos',
    loadComponent: () => import('./features/home/home-page/home-page').then((m) => m.HomePage),
  },
  {
    path: 'browse',
    loadChildren: () => import('./features/browse/browse.routes').then((m) => m.BROWSE_ROUTES),
  },
  {
    path: 'species',
    loadChildren: () => import('./features/species/species.routes').then((m) => m.SPECIES_ROUTES),
  },
  {
    path: 'calculate',
    loadChildren: () =>
      import('./features/calculate/calculate.routes').then((m) => m.CALCULATE_ROUTES),
  },
  {
    path: 'curation',
    canMatch: [roleGuard('curator', 'editor', 'admin')],
    loadChildren: () =>
      import('./features/curation/curation.routes').then((m) => m.CURATION_ROUTES),
  },
  {
    path: 'proposals/upload',
    title: 'Bulk upload · Thalpos',
    canMatch: [roleGuard('curator', 'editor', 'admin')],
    loadComponent: () =>
      import('./features/curation/upload/upload-page/upload-page').then((m) => m.UploadPage),
  },
  // E-mail links name a proposal by its plain address; the page lives under Curation.
  { path: 'proposals/:id', redirectTo: 'curation/proposals/:id' },
  {
    path: 'sources',
    loadChildren: () => import('./features/sources/sources.routes').then((m) => m.SOURCES_ROUTES),
  },
  {
    path: 'releases/drafts',
    canMatch: [roleGuard('editor', 'admin')],
    loadChildren: () =>
      import('./features/releases/drafts/drafts.routes').then((m) => m.RELEASE_DRAFT_ROUTES),
  },
  {
    path: 'integrate',
    canMatch: [roleGuard('reader', 'curator', 'editor', 'admin')],
    loadChildren: () =>
      import('./features/integrate/integrate.routes').then((m) => m.INTEGRATE_ROUTES),
  },
  {
    path: 'releases',
    loadChildren: () =>
      import('./features/releases/releases.routes').then((m) => m.RELEASES_ROUTES),
  },
  {
    path: 'audit',
    canMatch: [roleGuard('editor', 'admin')],
    loadChildren: () => import('./features/audit/audit.routes').then((m) => m.AUDIT_ROUTES),
  },
  {
    path: 'settings',
    canMatch: [roleGuard('reader', 'curator', 'editor', 'admin')],
    loadChildren: () =>
      import('./features/settings/settings.routes').then((m) => m.SETTINGS_ROUTES),
  },
  {
    path: 'admin',
    canMatch: [roleGuard('admin')],
    loadChildren: () => import('./features/admin/admin.routes').then((m) => m.ADMIN_ROUTES),
  },
  {
    path: 'not-allowed',
    title: 'Not allowed · Thalpos',
    loadComponent: () =>
      import('./core/not-allowed/not-allowed-page').then((m) => m.NotAllowedPage),
  },
  {
    path: '**',
    title: 'Page not found · Thalpos',
    loadComponent: () => import('./core/not-found/not-found-page').then((m) => m.NotFoundPage),
  },
];
