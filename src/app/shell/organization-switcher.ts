import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { Router } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { SessionStore } from '../session/session-store';
import { organizationLabel } from './organization-label';

/**
 * Which organization the person works in, by name. With one organization it is a plain label;
 * with several, a button opening the list to switch between them (the navigation then shows what
 * the role held there can use). Compact, so the bar keeps room for the navigation at 1280 px.
 */
@Component({
  selector: 'sc-organization-switcher',
  imports: [MatButtonModule, MatIconModule, MatMenuModule],
  template: `
    @if (choices().length > 1) {
      <button mat-button type="button" class="org" [matMenuTriggerFor]="orgs" [title]="current()">
        <mat-icon aria-hidden="true">apartment</mat-icon><span class="visually-hidden">Organization: </span><span class="label">{{ current() }}</span><mat-icon aria-hidden="true" iconPositionEnd>arrow_drop_down</mat-icon>
      </button>
      <mat-menu #orgs="matMenu" xPosition="before">
        @for (c of choices(); track c.organizationId) {
          <button mat-menu-item type="button" role="menuitemradio" [attr.aria-checked]="c.active" (click)="switchTo(c.organizationId)">
            <mat-icon aria-hidden="true">{{ c.active ? 'radio_button_checked' : 'radio_button_unchecked' }}</mat-icon>{{ c.label }}
          </button>
        }
      </mat-menu>
    } @else if (choices().length === 1) {
      <span class="org-name" [title]="current()"><mat-icon aria-hidden="true">apartment</mat-icon><span class="label">{{ current() }}</span></span>
    }
  `,
  styles: `
    :host { display: block; min-width: 0; }
    .org { color: #e8f3f2 !important; max-width: 230px; }
    .org-name { display: flex; align-items: center; gap: 6px; color: #cfe3e2; font-size: 13px; max-width: 230px; }
    .label { display: inline-block; max-width: 170px; white-space: nowrap; overflow: hidden; text-overflow: ellipsis; vertical-align: middle; font-size: 13px; }
    mat-icon { font-size: 20px; width: 20px; height: 20px; flex: none; }
    @media (max-width: 1100px) { .label { max-width: 110px; } }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrganizationSwitcher {
  protected readonly session = inject(SessionStore);
  private readonly router = inject(Router);

  protected readonly choices = computed(() => {
    const all = this.session.user()?.memberships ?? [];
    const active = this.session.membership()?.organizationId;
    return all.map((m) => ({ organizationId: m.organizationId, label: organizationLabel(m, all), active: m.organizationId === active }));
  });
  protected readonly current = computed(() => this.choices().find((c) => c.active)?.label ?? '');

  switchTo(organizationId: string): void {
    this.session.switchOrganization(organizationId);
    void this.router.navigateByUrl('/');
  }
}
