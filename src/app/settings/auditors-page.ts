import { ChangeDetectionStrategy, Component, computed, inject, signal, viewChild } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { problemMessage } from '../session/problem-message';
import { ClientsApi, type Client } from '../clients/clients-api';
import { DevicesApi, type DeviceRow } from '../devices/devices-api';
import type { AuditorScope } from '../../../shared/schemas/accounts';
import { AuditorGrantsApi, type AuditorGrantRow } from './auditor-grants-api';

const SCOPE_WORDS: Record<AuditorScope, string> = { all: 'Every issued report', client: 'Reports of one client', device: 'Reports of one device' };
const STATUS_WORDS: Record<AuditorGrantRow['status'], string> = { pending: 'Invited', active: 'Active', expired: 'Ended', revoked: 'Revoked' };

/** The day `days` after today in UTC, ISO; grants run to the end of their last day (UTC). */
function isoDaysFromNow(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

/** Read-only access for outside auditors to issued reports, until a last day; each grant is e-mailed as an invitation. */
@Component({
  selector: 'sc-auditors-page',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, MatTableModule],
  templateUrl: './auditors-page.html',
  styleUrl: './settings-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditorsPage {
  private readonly api = inject(AuditorGrantsApi);
  private readonly clientsApi = inject(ClientsApi);
  private readonly devicesApi = inject(DevicesApi);

  protected readonly scopeWords = SCOPE_WORDS;
  protected readonly scopes = Object.keys(SCOPE_WORDS) as AuditorScope[];
  protected readonly grants = signal<AuditorGrantRow[]>([]);
  protected readonly clients = signal<Client[]>([]);
  protected readonly devices = signal<DeviceRow[]>([]);
  protected readonly loading = signal(true);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly minDate = isoDaysFromNow(0);
  protected readonly columns = ['email', 'scope', 'expiresOn', 'status', 'actions'];
  private readonly formDirective = viewChild.required(FormGroupDirective);
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    scope: ['all' as AuditorScope, Validators.required],
    clientId: [''],
    deviceId: [''],
    expiresOn: [isoDaysFromNow(30), Validators.required],
    note: ['', Validators.maxLength(500)],
  });
  protected readonly scope = toSignal(this.form.controls.scope.valueChanges, { initialValue: this.form.controls.scope.value });
  private readonly clientNames = computed(() => new Map(this.clients().map((c) => [c.id, c.name])));
  private readonly deviceNames = computed(() => new Map(this.devices().map((d) => [d.id, `${d.model} s/n ${d.serialNumber}`])));

  constructor() {
    this.load();
    this.clientsApi.list().subscribe({ next: (p) => this.clients.set(p.items), error: (e) => this.error.set(problemMessage(e)) });
    this.devicesApi.list({ pageSize: 200 }).subscribe({ next: (p) => this.devices.set(p.items), error: (e) => this.error.set(problemMessage(e)) });
  }

  load(): void {
    this.loading.set(true);
    this.api.list().subscribe({
      next: (page) => {
        this.grants.set(page.items);
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }

  protected statusWord(g: AuditorGrantRow): string {
    return STATUS_WORDS[g.status] ?? g.status;
  }

  protected coverage(g: AuditorGrantRow): string {
    if (g.scope === 'client') return `Reports of ${this.clientNames().get(g.clientId ?? '') ?? 'a client'}`;
    if (g.scope === 'device') return `Reports on ${this.deviceNames().get(g.deviceId ?? '') ?? 'a device'}`;
    return SCOPE_WORDS.all;
  }

  grant(): void {
    const v = this.form.getRawValue();
    const missing = (v.scope === 'client' && !v.clientId) || (v.scope === 'device' && !v.deviceId);
    if (this.form.invalid || missing) {
      this.form.markAllAsTouched();
      if (missing) this.error.set(`Choose the ${v.scope} the access covers.`);
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    this.api
      .create({
        email: v.email.trim(),
        scope: v.scope,
        ...(v.scope === 'client' ? { clientId: v.clientId } : {}),
        ...(v.scope === 'device' ? { deviceId: v.deviceId } : {}),
        expiresOn: v.expiresOn,
        ...(v.note.trim() ? { note: v.note.trim() } : {}),
      })
      .subscribe({
        next: (g) => {
          this.busy.set(false);
          this.notice.set(`Access for ${g.email} until ${g.expiresOn}: an invitation is on its way.`);
          this.formDirective().resetForm();
          this.load();
        },
        error: (error) => {
          this.busy.set(false);
          this.error.set(problemMessage(error));
        },
      });
  }

  revoke(g: AuditorGrantRow): void {
    this.api.revoke(g.id).subscribe({
      next: () => {
        this.notice.set(`Access for ${g.email} was revoked.`);
        this.load();
      },
      error: (error) => this.error.set(problemMessage(error)),
    });
  }
}
