import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatSelectModule } from '@angular/material/select';
import { MatTooltipModule } from '@angular/material/tooltip';
import { SessionStore } from '../session/session-store';
import { ROLE_LABELS, type Role } from '../../../shared/access/roles';

interface NavItem {
  path: string;
  label: string;
  icon: string;
  roles: Role[];
  exact?: boolean;
}

const NAV: NavItem[] = [
  { path: '/', label: 'Bench board', icon: 'dashboard', roles: ['lab-admin', 'engineer', 'reviewer', 'billing'], exact: true },
  { path: '/devices', label: 'Devices', icon: 'settings_input_antenna', roles: ['lab-admin', 'engineer', 'reviewer'] },
  { path: '/reports', label: 'Reports', icon: 'verified', roles: ['lab-admin', 'engineer', 'reviewer', 'billing', 'manufacturer-admin', 'manufacturer-viewer'] },
];

@Component({
  selector: 'sc-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatButtonModule, MatIconModule, MatMenuModule, MatSelectModule, MatTooltipModule],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  protected readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  protected readonly nav = computed(() => NAV.filter((n) => this.session.hasRole(...n.roles)));
  protected readonly roleLabel = computed(() => this.session.roles().map((r) => ROLE_LABELS[r]).join(', '));
  protected readonly organizations = computed(() => this.session.user()?.memberships ?? []);

  switchTo(organizationId: string): void {
    this.session.switchOrganization(organizationId);
    void this.router.navigateByUrl('/');
  }

  async signOut(): Promise<void> {
    await this.session.signOut();
    await this.router.navigateByUrl('/sign-in');
  }
}
