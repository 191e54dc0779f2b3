import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { DatePipe, DecimalPipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { UploadsApi, type StoredFile, type UploadDetail, type UploadSummary } from '../runs/uploads-api';
import { UploadAnalysisView } from '../runs/upload-analysis-view';
import { saveBlob } from '../auditor/save-blob';
import { problemMessage } from '../session/problem-message';

/**
 * The evidence files of one test case for the reviewer: each upload with its SHA-256 and a download
 * of the raw bytes exactly as received, and the stored analysis of the latest one with its chart.
 */
@Component({
  selector: 'sc-case-files',
  imports: [DatePipe, DecimalPipe, MatButtonModule, MatIconModule, UploadAnalysisView],
  template: `
    @if (uploads().length) {
      <div class="files" role="region" [attr.aria-label]="'Files of ' + caseLabel()">
        <h3>Files</h3>
        <ul>
          @for (u of uploads(); track u.id; let first = $first) {
            <li>
              <div class="line">
                <span><strong>{{ u.file.name }}</strong>@if (u.data; as d) { + {{ d.name }}} · {{ u.format }} · {{ totalBytes(u) / 1e6 | number: '1.1-2' }} MB · {{ u.createdAt | date: 'd MMM y, HH:mm' }}{{ first ? ' · latest' : '' }}</span>
                <span class="downloads">
                  <button mat-button type="button" (click)="download(u.file)" [attr.aria-label]="'Raw file ' + u.file.name"><mat-icon>download</mat-icon>Raw file</button>
                  @if (u.data; as d) {
                    <button mat-button type="button" (click)="download(d)" [attr.aria-label]="'Samples ' + d.name"><mat-icon>download</mat-icon>Samples</button>
                  }
                </span>
              </div>
              <code class="sha" [attr.aria-label]="'SHA-256 of ' + u.file.name">SHA-256 {{ u.file.sha256 }}</code>
            </li>
          }
        </ul>
        @if (error(); as message) {
          <p class="sc-error-banner" role="alert">{{ message }}</p>
        }
        @if (latest(); as d) {
          <sc-upload-analysis-view [upload]="d" [kind]="kind()" />
        }
      </div>
    }
  `,
  styles: `
    h3 { font: 500 14px/1.3 Roboto, sans-serif; margin: 0 0 8px; }
    ul { list-style: none; margin: 0 0 12px; padding: 0; display: flex; flex-direction: column; gap: 6px; font-size: 13px; }
    .line { display: flex; align-items: center; justify-content: space-between; gap: 8px; flex-wrap: wrap; }
    .downloads { white-space: nowrap; }
    .sha { display: block; font-size: 11px; color: var(--sc-muted); overflow-wrap: anywhere; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseFiles {
  private readonly api = inject(UploadsApi);
  readonly uploads = input.required<UploadSummary[]>();
  readonly caseLabel = input.required<string>();
  readonly kind = input.required<string>();

  protected readonly latest = signal<UploadDetail | null>(null);
  protected readonly error = signal<string | null>(null);

  constructor() {
    effect(() => {
      const first = this.uploads()[0];
      if (!first) return;
      this.api.get(first.id).subscribe({ next: (d) => this.latest.set(d), error: (e) => this.error.set(problemMessage(e)) });
    });
  }

  protected totalBytes(u: UploadSummary): number {
    return u.file.sizeBytes + (u.data?.sizeBytes ?? 0);
  }

  download(file: StoredFile): void {
    this.error.set(null);
    this.api.raw(file).subscribe({ next: (blob) => saveBlob(blob, file.name), error: (e) => this.error.set(problemMessage(e)) });
  }
}
