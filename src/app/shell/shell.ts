import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatTooltipModule } from '@angular/material/tooltip';
import { SessionStore } from '../session/session-store';
import { SCREEN_ROLES } from '../accounts/screen-roles';
import { OrganizationSwitcher } from './organization-switcher';
import { ROLE_LABELS, type Role } from '../../../shared/access/roles';

interface NavItem {
  path: string;
  label: string;
  icon: string;
  roles: Role[];
  /** Shown to a person with no organization at all: an outside auditor. */
  auditor?: boolean;
  exact?: boolean;
}

const NAV: NavItem[] = [
  { path: '/', label: 'Bench board', icon: 'dashboard', roles: ['lab-admin', 'engineer', 'reviewer', 'billing'], exact: true },
  { path: '/devices', label: 'Devices', icon: 'settings_input_antenna', roles: ['lab-admin', 'engineer', 'reviewer'] },
  { path: '/clients', label: 'Clients', icon: 'groups', roles: [...SCREEN_ROLES.labRecords] },
  { path: '/equipment', label: 'Equipment', icon: 'speed', roles: [...SCREEN_ROLES.labRecords] },
  { path: '/rule-sets', label: 'Rule sets', icon: 'rule', roles: [...SCREEN_ROLES.labRecords] },
  { path: '/sales', label: 'Sales', icon: 'point_of_sale', roles: ['lab-admin', 'billing'] },
  { path: '/reports', label: 'Reports', icon: 'verified', roles: ['lab-admin', 'engineer', 'reviewer', 'billing', 'manufacturer-admin', 'manufacturer-viewer'] },
  { path: '/portal', label: 'Our devices', icon: 'inventory_2', roles: ['manufacturer-admin', 'manufacturer-viewer'], exact: true },
  { path: '/billing', label: 'Credits', icon: 'toll', roles: ['manufacturer-admin', 'manufacturer-viewer'] },
  { path: '/portal/precheck', label: 'Pre-check', icon: 'troubleshoot', roles: ['manufacturer-admin', 'manufacturer-viewer'] },
  { path: '/auditor', label: 'Shared with me', icon: 'policy', roles: [], auditor: true },
  { path: '/settings', label: 'Settings', icon: 'settings', roles: [...SCREEN_ROLES.people] },
];

@Component({
  selector: 'sc-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatButtonModule, MatIconModule, MatMenuModule, MatTooltipModule, OrganizationSwitcher],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  protected readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  protected readonly nav = computed(() => NAV.filter((n) => (n.auditor ? this.session.user()?.memberships.length === 0 : this.session.hasRole(...n.roles))));
  protected readonly roleLabel = computed(() => this.session.roles().map((r) => ROLE_LABELS[r]).join(', '));

  async signOut(): Promise<void> {
    await this.session.signOut();
    await this.router.navigateByUrl('/sign-in');
  }
}
