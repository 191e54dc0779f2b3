import { ChangeDetectionStrategy, Component, computed, inject, signal, viewChild } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { SessionStore } from '../session/session-store';
import { problemMessage } from '../session/problem-message';
import { LAB_ROLES, MANUFACTURER_ROLES, ROLE_LABELS, type Role } from '../../../shared/access/roles';
import { PeopleApi, type Member, type OpenInvitation } from './people-api';

/** Members of the active organization with their roles, the invitation form and the invitations still open. */
@Component({
  selector: 'sc-people-page',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, MatTableModule],
  templateUrl: './people-page.html',
  styleUrl: './settings-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeoplePage {
  private readonly api = inject(PeopleApi);
  private readonly session = inject(SessionStore);

  protected readonly roleLabels = ROLE_LABELS;
  protected readonly roles = computed<readonly Role[]>(() => (this.session.membership()?.kind === 'manufacturer' ? MANUFACTURER_ROLES : LAB_ROLES));
  protected readonly activeOrganizationId = computed(() => this.session.membership()?.organizationId ?? null);
  protected readonly members = signal<Member[]>([]);
  protected readonly invitations = signal<OpenInvitation[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly sending = signal(false);
  protected readonly memberColumns = ['name', 'roles', 'memberSince', 'actions'];
  protected readonly invitationColumns = ['email', 'role', 'expiresAt', 'actions'];
  private readonly formDirective = viewChild.required(FormGroupDirective);
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email]],
    role: [this.session.membership()?.kind === 'manufacturer' ? 'manufacturer-viewer' : 'engineer', Validators.required],
  });

  constructor() {
    this.load();
  }

  /** Read members and invitations again; `keepError` leaves a refusal just shown on screen. */
  load(keepError = false): void {
    this.loading.set(true);
    if (!keepError) this.error.set(null);
    this.api.members().subscribe({
      next: (page) => {
        this.members.set(page.items);
        this.loading.set(false);
      },
      error: (error) => this.fail(error),
    });
    this.api.invitations().subscribe({ next: (page) => this.invitations.set(page.items), error: (error) => this.fail(error) });
  }

  invite(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, role } = this.form.getRawValue();
    this.sending.set(true);
    this.error.set(null);
    this.api.invite({ email: email.trim(), role: role as Role }).subscribe({
      next: (invitation) => {
        this.sending.set(false);
        this.notice.set(`Invitation sent to ${invitation.email}. The link works for 7 days.`);
        // resetForm also clears the submitted state, so the emptied field shows no error.
        this.formDirective().resetForm({ email: '', role });
        this.load();
      },
      error: (error) => {
        this.sending.set(false);
        this.error.set(problemMessage(error));
      },
    });
  }

  /** Save a member's roles when the role list closes, if they changed. */
  saveRoles(member: Member, roles: Role[]): void {
    if (roles.length === 0) {
      this.error.set(`Everyone keeps at least one role. To take ${member.name} out of the organization, remove them instead.`);
      this.load(true);
      return;
    }
    if ([...roles].sort().join() === [...member.roles].sort().join()) return;
    this.error.set(null);
    this.api.setRoles(member.userId, roles).subscribe({
      next: () => {
        this.notice.set(`${member.name} now holds: ${roles.map((r) => ROLE_LABELS[r]).join(', ')}.`);
        this.load();
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.load(true);
      },
    });
  }

  remove(member: Member): void {
    if (!confirm(`Remove ${member.name} (${member.email}) from the organization? Their account stays.`)) return;
    this.api.removeMember(member.userId).subscribe({
      next: () => {
        this.notice.set(`${member.name} was removed.`);
        this.load();
      },
      error: (error) => this.error.set(problemMessage(error)),
    });
  }

  revoke(invitation: OpenInvitation): void {
    this.api.revokeInvitation(invitation.id).subscribe({
      next: () => {
        this.notice.set(`The invitation to ${invitation.email} was withdrawn; its link no longer works.`);
        this.load();
      },
      error: (error) => this.error.set(problemMessage(error)),
    });
  }

  protected roleLabel(role: Role | null): string {
    return role ? ROLE_LABELS[role] : '—';
  }

  protected isMe(member: Member): boolean {
    return member.userId === this.session.user()?.userId;
  }

  private fail(error: unknown): void {
    this.error.set(problemMessage(error));
    this.loading.set(false);
  }
}
