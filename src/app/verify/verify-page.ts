import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatIconModule } from '@angular/material/icon';
import { VerifyApi, type VerifiedReport } from './verify-api';
import { problemMessage } from '../session/problem-message';

/** Public page (no sign-in): is this report authentic and current, and is this file the one issued? */
@Component({
  selector: 'sc-verify-page',
  imports: [DatePipe, MatProgressBarModule, MatIconModule],
  templateUrl: './verify-page.html',
  styleUrl: './verify-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerifyPage {
  private readonly api = inject(VerifyApi);
  readonly token = input.required<string>();

  protected readonly report = signal<VerifiedReport | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly dragging = signal(false);
  protected readonly check = signal<{ fileName: string; sha256: string; matches: boolean } | null>(null);
  protected readonly hashing = signal(false);
  protected readonly hashError = signal<string | null>(null);

  constructor() {
    effect(() => {
      this.loading.set(true);
      this.api.lookup(this.token()).subscribe({
        next: (r) => {
          this.report.set(r);
          this.loading.set(false);
        },
        error: (e) => {
          this.error.set(e instanceof HttpErrorResponse && e.status === 404 ? 'No report is registered under this verification link. It may have been mistyped.' : problemMessage(e));
          this.loading.set(false);
        },
      });
    });
  }

  onDrop(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    const file = event.dataTransfer?.files?.[0];
    if (file) void this.hashFile(file);
  }

  onPick(event: Event): void {
    const file = (event.target as HTMLInputElement).files?.[0];
    if (file) void this.hashFile(file);
  }

  async hashFile(file: File): Promise<void> {
    this.hashing.set(true);
    this.hashError.set(null);
    this.check.set(null);
    try {
      // crypto.subtle exists only on secure pages (https or localhost).
      const digest = await crypto.subtle.digest('SHA-256', await file.arrayBuffer());
      const sha256 = [...new Uint8Array(digest)].map((b) => b.toString(16).padStart(2, '0')).join('');
      this.check.set({ fileName: file.name, sha256, matches: sha256 === this.report()?.sha256 });
    } catch {
      this.hashError.set(`${file.name} could not be checked in this browser. Compare its SHA-256 with the one above using another tool.`);
    } finally {
      this.hashing.set(false);
    }
  }
}
