import type { Routes } from '@angular/router';
import { signedInGuard } from './session/signed-in-guard';
import { labMemberGuard } from './session/lab-member-guard';
import { roleGuard } from './accounts/role-guard';
import { SCREEN_ROLES } from './accounts/screen-roles';

const MANUFACTURER = ['manufacturer-admin', 'manufacturer-viewer'] as const;

export const routes: Routes = [
  { path: 'sign-in', loadComponent: () => import('./session/sign-in-page').then((m) => m.SignInPage), title: 'Sign in · Sidecheck' },
  { path: 'verify/:token', loadComponent: () => import('./verify/verify-page').then((m) => m.VerifyPage), title: 'Verify a report · Sidecheck' },
  { path: 'sign-up', loadComponent: () => import('./accounts/sign-up-page').then((m) => m.SignUpPage), title: 'Sign up a lab · Sidecheck' },
  // The e-mailed links (server/accounts/send-invitation.ts, password-reset.ts) point at these two.
  { path: 'invitations/:token', loadComponent: () => import('./accounts/accept-invitation-page').then((m) => m.AcceptInvitationPage), title: 'Your invitation · Sidecheck' },
  { path: 'password-reset', pathMatch: 'full', loadComponent: () => import('./accounts/password-reset-request-page').then((m) => m.PasswordResetRequestPage), title: 'Reset your password · Sidecheck' },
  { path: 'password-reset/:token', loadComponent: () => import('./accounts/password-reset-complete-page').then((m) => m.PasswordResetCompletePage), title: 'Choose a new password · Sidecheck' },
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
      { path: 'runs/:id/review', loadComponent: () => import('./review/review-page').then((m) => m.ReviewPage), canActivate: [labMemberGuard], title: 'Review · Sidecheck' },
      { path: 'portal', loadComponent: () => import('./portal/portal-page').then((m) => m.PortalPage), canActivate: [roleGuard(MANUFACTURER)], title: 'Our reports · Sidecheck' },
      { path: 'portal/precheck', loadComponent: () => import('./portal/precheck-page').then((m) => m.PrecheckPage), canActivate: [roleGuard(MANUFACTURER)], title: 'Engineering pre-check · Sidecheck' },
      // The payment provider returns buyers here (server/billing/start-checkout.ts).
      { path: 'billing', loadComponent: () => import('./portal/credits-page').then((m) => m.CreditsPage), canActivate: [roleGuard(MANUFACTURER)], title: 'Report credits · Sidecheck' },
      { path: 'sales', loadComponent: () => import('./billing/lab-billing-page').then((m) => m.LabBillingPage), canActivate: [roleGuard(['lab-admin', 'billing'])], title: 'Sales and credits · Sidecheck' },
      { path: 'devices/:id/edit', loadComponent: () => import('./devices/device-form-page').then((m) => m.DeviceFormPage), canActivate: [roleGuard(SCREEN_ROLES.labRecordsWrite)], title: 'Change device · Sidecheck' },
      { path: 'clients', loadComponent: () => import('./clients/clients-page').then((m) => m.ClientsPage), canActivate: [roleGuard(SCREEN_ROLES.labRecords)], title: 'Clients · Sidecheck' },
      { path: 'clients/new', loadComponent: () => import('./clients/client-form-page').then((m) => m.ClientFormPage), canActivate: [roleGuard(SCREEN_ROLES.labRecordsWrite)], title: 'Add a client · Sidecheck' },
      { path: 'clients/:id/edit', loadComponent: () => import('./clients/client-form-page').then((m) => m.ClientFormPage), canActivate: [roleGuard(SCREEN_ROLES.labRecordsWrite)], title: 'Change client · Sidecheck' },
      { path: 'equipment', loadComponent: () => import('./equipment/equipment-page').then((m) => m.EquipmentPage), canActivate: [roleGuard(SCREEN_ROLES.labRecords)], title: 'Equipment register · Sidecheck' },
      { path: 'equipment/new', loadComponent: () => import('./equipment/instrument-form-page').then((m) => m.InstrumentFormPage), canActivate: [roleGuard(SCREEN_ROLES.labRecordsWrite)], title: 'Add an instrument · Sidecheck' },
      { path: 'equipment/:id/edit', loadComponent: () => import('./equipment/instrument-form-page').then((m) => m.InstrumentFormPage), canActivate: [roleGuard(SCREEN_ROLES.labRecordsWrite)], title: 'Change instrument · Sidecheck' },
      { path: 'rule-sets', loadComponent: () => import('./rule-sets/rule-sets-page').then((m) => m.RuleSetsPage), canActivate: [roleGuard(SCREEN_ROLES.labRecords)], title: 'Rule sets · Sidecheck' },
      { path: 'rule-sets/:id', loadComponent: () => import('./rule-sets/rule-set-editor-page').then((m) => m.RuleSetEditorPage), canActivate: [roleGuard(SCREEN_ROLES.labRecords)], title: 'Rule set · Sidecheck' },
      {
        path: 'settings',
        loadComponent: () => import('./settings/settings-page').then((m) => m.SettingsPage),
        canActivate: [roleGuard(SCREEN_ROLES.people)],
        children: [
          { path: '', pathMatch: 'full', redirectTo: 'people' },
          { path: 'people', loadComponent: () => import('./settings/people-page').then((m) => m.PeoplePage), title: 'People · Sidecheck' },
          { path: 'api-keys', loadComponent: () => import('./settings/api-keys-page').then((m) => m.ApiKeysPage), canActivate: [roleGuard(SCREEN_ROLES.labAdmin)], title: 'API keys · Sidecheck' },
          { path: 'lab', loadComponent: () => import('./settings/lab-details-page').then((m) => m.LabDetailsPage), canActivate: [roleGuard(SCREEN_ROLES.labAdmin)], title: 'Lab details · Sidecheck' },
          { path: 'auditors', loadComponent: () => import('./settings/auditors-page').then((m) => m.AuditorsPage), canActivate: [roleGuard(SCREEN_ROLES.labAdmin)], title: 'Auditor access · Sidecheck' },
        ],
      },
      { path: 'auditor', loadComponent: () => import('./auditor/auditor-page').then((m) => m.AuditorPage), title: 'Reports shared with you · Sidecheck' },
    ],
  },
  { path: '**', redirectTo: '' },
];
