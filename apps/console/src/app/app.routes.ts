import { inject } from '@angular/core';
import type { Routes } from '@angular/router';
import { AuthSession } from './core/auth/auth-session';
import { homePath } from './shell/nav-items';
import { capabilityGuard } from './core/auth/capability.guard';
import { signedInGuard } from './core/auth/signed-in.guard';

export const appRoutes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Tallyfit',
    loadComponent: () => import('./pages/sign-in/sign-in-page').then((m) => m.SignInPage),
  },
  {
    path: '',
    canActivate: [signedInGuard],
    loadComponent: () => import('./shell/app-shell').then((m) => m.AppShell),
    children: [
      { path: '', pathMatch: 'full', redirectTo: () => homePath(inject(AuthSession).role()) },
      {
        path: 'studies',
        title: 'Studies · Tallyfit',
        loadComponent: () => import('./pages/studies/studies-page').then((m) => m.StudiesPage),
      },
      {
        path: 'studies/:id',
        title: 'Study · Tallyfit',
        loadComponent: () => import('./pages/study/study-page').then((m) => m.StudyPage),
      },
      {
        path: 'history',
        title: 'History · Tallyfit',
        loadComponent: () => import('./pages/history/history-page').then((m) => m.HistoryPage),
      },
      {
        path: 'watches',
        title: 'Watches · Tallyfit',
        loadComponent: () => import('./pages/watches/watches-page').then((m) => m.WatchesPage),
      },
      {
        path: 'watches/new',
        title: 'New watch · Tallyfit',
        canMatch: [capabilityGuard('watches.manage')],
        loadComponent: () => import('./pages/watch-form/watch-form-page').then((m) => m.WatchFormPage),
      },
      {
        path: 'watches/:id/edit',
        title: 'Change a watch · Tallyfit',
        canMatch: [capabilityGuard('watches.manage')],
        loadComponent: () => import('./pages/watch-form/watch-form-page').then((m) => m.WatchFormPage),
      },
      {
        path: 'watches/:id',
        title: 'Watch · Tallyfit',
        loadComponent: () => import('./pages/watch/watch-page').then((m) => m.WatchPage),
      },
      {
        path: 'connections',
        title: 'Team databases · Tallyfit',
        canMatch: [capabilityGuard('connections.manage')],
        loadComponent: () => import('./pages/connections/connections-page').then((m) => m.ConnectionsPage),
      },
      {
        path: 'tokens',
        title: 'API tokens · Tallyfit',
        loadComponent: () => import('./pages/tokens/tokens-page').then((m) => m.TokensPage),
      },
      {
        // Each page of the admin area has its own guard.
        path: 'admin',
        loadChildren: () => import('./pages/admin/admin.routes').then((m) => m.adminRoutes),
      },
      {
        path: 'reviews',
        title: 'To review · Tallyfit',
        canMatch: [capabilityGuard('analyses.review')],
        loadComponent: () => import('./pages/reviews/reviews-page').then((m) => m.ReviewsPage),
      },
      {
        path: 'notifications',
        title: 'Notifications · Tallyfit',
        loadComponent: () => import('./pages/notifications/notifications-page').then((m) => m.NotificationsPage),
      },
      {
        path: 'analyses',
        title: 'My analyses · Tallyfit',
        loadComponent: () => import('./pages/analyses/analyses-page').then((m) => m.AnalysesPage),
      },
      {
        path: 'analyses/new',
        title: 'New analysis · Tallyfit',
        canMatch: [capabilityGuard('analyses.run')],
        loadComponent: () => import('./pages/new-analysis/new-analysis-page').then((m) => m.NewAnalysisPage),
      },
      {
        path: 'planner',
        title: 'Planner · Tallyfit',
        canMatch: [capabilityGuard('engine.compute')],
        loadComponent: () => import('./pages/planner/planner-page').then((m) => m.PlannerPage),
      },
      {
        path: 'analyses/:id',
        title: 'Analysis · Tallyfit',
        loadComponent: () => import('./pages/analysis/analysis-page').then((m) => m.AnalysisPage),
      },
    ],
  },
  { path: '**', redirectTo: '' },
];
