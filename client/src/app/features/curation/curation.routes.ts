import { Routes } from '@angular/router';

import { roleGuard } from '../../core/auth-guard';

/** Mounted under `/curation`, behind `roleGuard('curator', 'editor', 'admin')`. */
export const CURATION_ROUTES: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'proposals' },
  {
    path: 'propose',
    title: 'Propose · Thalpos',
    loadComponent: () => import('./proposal-form/proposal-form').then((m) => m.ProposalForm),
  },
  {
    path: 'proposals',
    title: 'My proposals · Thalpos',
    loadComponent: () => import('./my-proposals/my-proposals').then((m) => m.MyProposals),
  },
  {
    path: 'proposals/:id',
    title: 'Proposal · Thalpos',
    loadComponent: () => import('./proposal-page/proposal-page').then((m) => m.ProposalPage),
  },
  {
    path: 'proposals/:id/edit',
    title: 'Revise proposal · Thalpos',
    loadComponent: () => import('./proposal-form/proposal-form').then((m) => m.ProposalForm),
  },
  {
    path: 'review',
    title: 'Review · Thalpos',
    canMatch: [roleGuard('editor', 'admin')],
    loadComponent: () => import('./review-queue/review-queue').then((m) => m.ReviewQueue),
  },
];
