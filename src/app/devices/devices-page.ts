import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { DevicesApi, type DeviceRow } from './devices-api';
import { problemMessage } from '../session/problem-message';
import { SessionStore } from '../session/session-store';

@Component({
  selector: 'sc-devices-page',
  imports: [DecimalPipe, RouterLink, MatTableModule, MatButtonModule, MatIconModule, MatProgressBarModule],
  template: `
    <div class="sc-page">
      <div class="sc-page-head">
        <div>
          <h1>Devices under test</h1>
          <p class="sc-sub">Radios received for testing, newest first.</p>
        </div>
        @if (session.hasRole('engineer', 'lab-admin')) {
          <a mat-flat-button routerLink="/devices/new"><mat-icon>add</mat-icon>Register a device</a>
        }
      </div>
      <div class="sc-card table-card">
        @if (loading()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading devices" />
        }
        @if (error(); as message) {
          <div class="sc-error-banner" role="alert">{{ message }}</div>
        }
        <table mat-table [dataSource]="rows()" aria-label="Devices under test">
          <ng-container matColumnDef="model">
            <th mat-header-cell *matHeaderCellDef>Model</th>
            <td mat-cell *matCellDef="let d"><div>{{ d.model }}</div><div class="sc-muted small">{{ d.manufacturer }}</div></td>
          </ng-container>
          <ng-container matColumnDef="serial">
            <th mat-header-cell *matHeaderCellDef>Serial</th>
            <td mat-cell *matCellDef="let d">{{ d.serialNumber }}</td>
          </ng-container>
          <ng-container matColumnDef="designator">
            <th mat-header-cell *matHeaderCellDef>Emission</th>
            <td mat-cell *matCellDef="let d">{{ d.emissionDesignator }}</td>
          </ng-container>
          <ng-container matColumnDef="pep">
            <th mat-header-cell *matHeaderCellDef>Rated PEP</th>
            <td mat-cell *matCellDef="let d">{{ d.ratedPepW | number: '1.0-1' }} W</td>
          </ng-container>
          <ng-container matColumnDef="actions">
            <th mat-header-cell *matHeaderCellDef><span class="visually-hidden">Actions</span></th>
            <td mat-cell *matCellDef="let d">
              @if (session.hasRole('engineer', 'lab-admin')) {
                <a mat-button [routerLink]="['/devices', d.id, 'edit']" [attr.aria-label]="'Change ' + d.model + ' s/n ' + d.serialNumber">Change</a>
                <a mat-button [routerLink]="['/plans/new']" [queryParams]="{ deviceId: d.id }">Build a test plan</a>
              }
            </td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
        </table>
        @if (!loading() && !error() && rows().length === 0) {
          <div class="sc-empty">No devices yet.</div>
        }
      </div>
    </div>
  `,
  styles: `.table-card { padding: 0; overflow: hidden; } table { width: 100%; } .small { font-size: 12px; }`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DevicesPage {
  private readonly api = inject(DevicesApi);
  protected readonly session = inject(SessionStore);
  protected readonly columns = ['model', 'serial', 'designator', 'pep', 'actions'];
  protected readonly rows = signal<DeviceRow[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);

  constructor() {
    this.api.list({ pageSize: 100 }).subscribe({
      next: (page) => {
        this.rows.set(page.items);
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }
}
