import { Routes } from '@angular/router';

/** Mounted under `/audit`, behind `roleGuard('editor', 'admin')`. */
export const AUDIT_ROUTES: Routes = [
  {
    path: '',
    title: 'Audit log · Thalpos',
    loadComponent: () => import('./audit-page/audit-page').then((m) => m.AuditLogPage),
  },
];
