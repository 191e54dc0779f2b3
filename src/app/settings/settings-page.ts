import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatTabsModule } from '@angular/material/tabs';
import { SessionStore } from '../session/session-store';
import { SCREEN_ROLES } from '../accounts/screen-roles';
import type { Role } from '../../../shared/access/roles';

interface SettingsTab {
  path: string;
  label: string;
  roles: readonly Role[];
}

const TABS: SettingsTab[] = [
  { path: 'people', label: 'People', roles: SCREEN_ROLES.people },
  { path: 'api-keys', label: 'API keys', roles: SCREEN_ROLES.labAdmin },
  { path: 'lab', label: 'Lab details', roles: SCREEN_ROLES.labAdmin },
  { path: 'auditors', label: 'Auditor access', roles: SCREEN_ROLES.labAdmin },
];

/** The organization's settings: one tab per area, each shown only to the roles that can use it. */
@Component({
  selector: 'sc-settings-page',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatTabsModule],
  template: `
    <div class="sc-page">
      <div class="sc-page-head">
        <div>
          <h1>Settings</h1>
          <p class="sc-sub">{{ session.membership()?.organizationName ?? 'Your organization' }}: people, access and the details printed on reports.</p>
        </div>
      </div>
      <nav mat-tab-nav-bar [tabPanel]="panel" aria-label="Settings areas">
        @for (tab of tabs(); track tab.path) {
          <a mat-tab-link [routerLink]="tab.path" routerLinkActive #rla="routerLinkActive" [active]="rla.isActive">{{ tab.label }}</a>
        }
      </nav>
      <mat-tab-nav-panel #panel>
        <div class="panel"><router-outlet /></div>
      </mat-tab-nav-panel>
    </div>
  `,
  styles: `.panel { padding-top: 20px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingsPage {
  protected readonly session = inject(SessionStore);
  protected readonly tabs = computed(() => TABS.filter((t) => this.session.hasRole(...t.roles)));
}
