import type { Routes } from '@angular/router';
import { unsavedChanges } from './confirm/unsaved-changes';
import { signedIn, signedOut, withPermission } from './session/guards';
import { Shell } from './shell/shell';

/**
 * The console's screens. Sign-in and the invitation page stand alone; everything else sits in the shell
 * and needs a session; admin screens need the `admin` permission, editing needs `models:write`. The API
 * checks every call again: these guards only keep people away from screens they cannot use.
 */
export const routes: Routes = [
  { path: 'sign-in', canActivate: [signedOut], title: 'Sign in', loadComponent: () => import('./sign-in/sign-in').then((m) => m.SignIn) },
  { path: 'invitations/:token', title: 'Join your team', loadComponent: () => import('./invitation/invitation').then((m) => m.Invitation) },
  {
    path: '',
    component: Shell,
    canActivate: [signedIn],
    canActivateChild: [signedIn],
    children: [
      { path: '', pathMatch: 'full', redirectTo: 'models' },
      { path: 'models', title: 'Models', loadComponent: () => import('./models/model-library').then((m) => m.ModelLibrary) },
      { path: 'models/new', title: 'New model', canActivate: [withPermission('models:write')], canDeactivate: [unsavedChanges], loadComponent: () => import('./model-editor/model-editor').then((m) => m.ModelEditor) },
      { path: 'models/:id', title: 'Model', loadComponent: () => import('./model-page/model-page').then((m) => m.ModelPage) },
      { path: 'models/:id/edit', title: 'Edit model', canActivate: [withPermission('models:write')], canDeactivate: [unsavedChanges], loadComponent: () => import('./model-editor/model-editor').then((m) => m.ModelEditor) },
      { path: 'models/:id/design', title: 'Design', canDeactivate: [unsavedChanges], loadComponent: () => import('./design/design-workspace').then((m) => m.DesignWorkspace) },
      { path: 'transfer', title: 'Import and export', loadComponent: () => import('./transfer/transfer').then((m) => m.Transfer) },
      { path: 'embed', title: 'Embed', loadComponent: () => import('./embed/embed-builder').then((m) => m.EmbedBuilder) },
      { path: 'keys', title: 'API keys', canActivate: [withPermission('admin')], loadComponent: () => import('./keys/key-list').then((m) => m.KeyList) },
      { path: 'people', title: 'People', canActivate: [withPermission('admin')], loadComponent: () => import('./people/people-list').then((m) => m.PeopleList) },
      { path: 'mailbox', title: 'Mailbox', canActivate: [withPermission('admin')], loadComponent: () => import('./mailbox/mailbox').then((m) => m.Mailbox) },
      { path: 'audit', title: 'Audit log', canActivate: [withPermission('admin')], loadComponent: () => import('./audit/audit-log').then((m) => m.AuditLog) },
      { path: 'account', title: 'My account', loadComponent: () => import('./account/account').then((m) => m.Account) },
      { path: 'not-allowed', title: 'Not for your role', loadComponent: () => import('./not-found/not-allowed').then((m) => m.NotAllowed) },
      { path: '**', title: 'Not found', loadComponent: () => import('./not-found/not-found').then((m) => m.NotFound) },
    ],
  },
];
