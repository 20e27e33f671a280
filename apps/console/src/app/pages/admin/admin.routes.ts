import type { Routes } from '@angular/router';
import { capabilityGuard } from '../../core/auth/capability.guard';

/** The admin area, loaded only when an admin (or, for the audit trail, a lead) opens it. */
export const adminRoutes: Routes = [
  { path: '', pathMatch: 'full', redirectTo: 'people' },
  {
    path: 'people',
    title: 'People · Tallyfit',
    canMatch: [capabilityGuard('people.manage')],
    loadComponent: () => import('./people/people-page').then((m) => m.PeoplePage),
  },
  {
    path: 'audit',
    title: 'Audit trail · Tallyfit',
    canMatch: [capabilityGuard('audit.read')],
    loadComponent: () => import('./audit/audit-page').then((m) => m.AuditPage),
  },
  {
    path: 'outbox',
    title: 'Mail outbox · Tallyfit',
    canMatch: [capabilityGuard('outbox.read')],
    loadComponent: () => import('./outbox/outbox-page').then((m) => m.OutboxPage),
  },
];
