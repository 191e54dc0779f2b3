import type { Routes } from '@angular/router';
import { signedInGuard } from './session/signed-in-guard';
import { labMemberGuard } from './session/lab-member-guard';

export const routes: Routes = [
  { path: 'sign-in', loadComponent: () => import('./session/sign-in-page').then((m) => m.SignInPage), title: 'Sign in · Sidecheck' },
  { path: 'verify/:token', loadComponent: () => import('./verify/verify-page').then((m) => m.VerifyPage), title: 'Verify a report · Sidecheck' },
  {
    path: '',
    loadComponent: () => import('./shell/shell').then((m) => m.Shell),
    canActivate: [signedInGuard],
    children: [
      { path: '', pathMatch: 'full', loadComponent: () => import('./home/home-page').then((m) => m.HomePage), canActivate: [labMemberGuard], title: 'Bench board · Sidecheck' },
      { path: 'devices', loadComponent: () => import('./devices/devices-page').then((m) => m.DevicesPage), canActivate: [labMemberGuard], title: 'Devices · Sidecheck' },
      { path: 'devices/new', loadComponent: () => import('./devices/device-form-page').then((m) => m.DeviceFormPage), canActivate: [labMemberGuard], title: 'New device · Sidecheck' },
      { path: 'plans/new', loadComponent: () => import('./plans/plan-form-page').then((m) => m.PlanFormPage), canActivate: [labMemberGuard], title: 'New test plan · Sidecheck' },
      { path: 'runs/:id', loadComponent: () => import('./runs/run-workspace').then((m) => m.RunWorkspace), canActivate: [labMemberGuard], title: 'Run · Sidecheck' },
      { path: 'reports', loadComponent: () => import('./reports/reports-page').then((m) => m.ReportsPage), title: 'Reports · Sidecheck' },
    ],
  },
  { path: '**', redirectTo: '' },
];
