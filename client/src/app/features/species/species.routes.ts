import { Routes } from '@angular/router';

/** Mounted under `/species`; public. `/species/water?release=2026.1` opens one species. */
export const SPECIES_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: '/browse' },
  {
    path: ':key',
    title: 'Species · Thalpos',
    loadComponent: () => import('./species-page/species-page').then((m) => m.SpeciesPage),
  },
];
