import type { Routes } from '@angular/router';
import { signedInGuard } from './core/auth/signed-in-guard';
import { Shell } from './core/shell/shell';

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in · Clinometer',
    loadComponent: () => import('./core/sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    path: '',
    component: Shell,
    canActivateChild: [signedInGuard],
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'runs' },
      {
        path: 'runs',
        title: 'Runs · Clinometer',
        loadChildren: () => import('./runs/runs.routes').then((m) => m.runsRoutes),
      },
      {
        path: 'specs',
        title: 'Specs · Clinometer',
        loadChildren: () => import('./specs/specs.routes').then((m) => m.specsRoutes),
      },
      {
        path: 'uploads',
        title: 'Uploads · Clinometer',
        loadChildren: () => import('./uploads/uploads.routes').then((m) => m.uploadsRoutes),
      },
      {
        path: 'releases',
        title: 'Releases · Clinometer',
        loadChildren: () => import('./releases/releases.routes').then((m) => m.releasesRoutes),
      },
      {
        path: 'mailroom',
        title: 'Mailroom · Clinometer',
        loadChildren: () => import('./mailroom/mailroom.routes').then((m) => m.mailroomRoutes),
      },
      {
        path: 'people',
        title: 'People · Clinometer',
        loadChildren: () => import('./people/people.routes').then((m) => m.peopleRoutes),
      },
      {
        path: 'audit',
        title: 'Audit · Clinometer',
        loadChildren: () => import('./audit/audit.routes').then((m) => m.auditRoutes),
      },
      {
        path: '**',
        title: 'Not found · Clinometer',
        loadComponent: () => import('./core/not-found/not-found').then((m) => m.NotFound),
      },
    ],
  },
];
