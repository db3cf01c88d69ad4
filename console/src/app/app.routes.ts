import type { Route, Routes } from '@angular/router';
import type { AreaPath } from './core/areas';
import { openToRole } from './core/auth/area-roles';
import { signedInGuard } from './core/auth/signed-in-guard';
import { Shell } from './core/shell/shell';

/** Reached only when the area's own route does not match the person's role (see `openToRole`). */
function notOpenToRole(area: AreaPath): Route {
  return {
    path: area,
    title: 'Not open to your role · Clinometer',
    data: { area },
    loadComponent: () => import('./core/no-access/no-access').then((m) => m.NoAccess),
  };
}

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
        canMatch: [openToRole('people')],
        loadChildren: () => import('./people/people.routes').then((m) => m.peopleRoutes),
      },
      {
        path: 'audit',
        title: 'Audit · Clinometer',
        canMatch: [openToRole('audit')],
        loadChildren: () => import('./audit/audit.routes').then((m) => m.auditRoutes),
      },
      notOpenToRole('people'),
      notOpenToRole('audit'),
      {
        path: '**',
        title: 'Not found · Clinometer',
        loadComponent: () => import('./core/not-found/not-found').then((m) => m.NotFound),
      },
    ],
  },
];
