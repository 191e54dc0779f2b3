import { ChangeDetectionStrategy, Component, computed, effect, inject, input, output, signal, untracked } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { HttpEventType } from '@angular/common/http';
import { FormsModule } from '@angular/forms';
import type { Subscription } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { EVALUABLE_KINDS } from '../../../shared/evaluation/evaluate-trace';
import type { TestKind } from '../../../shared/rules/test-kind';
import type { UploadFields } from '../../../shared/schemas/uploads';
import { problemMessage } from '../session/problem-message';
import { UploadsApi, type UploadDetail, type UploadParts } from './uploads-api';
import { uploadPlan, type UploadPlan } from './upload-plan';
import { UploadAnalysisView } from './upload-analysis-view';
import { FileDrop } from './file-drop';

/** Which kinds of evidence can decide a test kind (shared/evaluation EVALUABLE_KINDS). */
export function evidenceFor(kind: TestKind): ('trace' | 'iq')[] {
  return (['trace', 'iq'] as const).filter((source) => EVALUABLE_KINDS[source].includes(kind));
}

/**
 * The upload panel of a trace or I/Q test case: choose or drop the file(s), give what the file
 * does not say (the reference level of a mask trace, the rate of raw samples), upload with a
 * progress bar and a Cancel button, then the analysis the server stored. The latest stored
 * upload of the case is shown when the panel opens.
 */
@Component({
  selector: 'sc-case-upload',
  imports: [DecimalPipe, FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, UploadAnalysisView, FileDrop],
  templateUrl: './case-upload.html',
  styleUrl: './case-upload.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseUpload {
  private readonly api = inject(UploadsApi);

  readonly runId = input.required<string>();
  readonly caseId = input.required<string>();
  readonly kind = input.required<TestKind>();
  /** What the emission mask is relative to (the rule set's mask reference). */
  readonly maskReference = input<'pep' | 'mean'>('mean');
  readonly editable = input(false);
  /** The case's latest upload, whose stored analysis is shown until another is sent. */
  readonly latestUploadId = input<string | null>(null);
  readonly uploaded = output<UploadDetail>();

  protected readonly accepts = computed(() => evidenceFor(this.kind()));
  protected readonly acceptAttr = computed(() => [...(this.accepts().includes('trace') ? ['.csv', '.txt'] : []), ...(this.accepts().includes('iq') ? ['.sigmf-meta', '.sigmf-data', '.wav', '.cf32', '.cfile', '.fc32', '.ci16', '.cs16', '.sc16'] : [])].join(','));
  protected readonly files = signal<File[]>([]);
  protected readonly plan = signal<UploadPlan | null>(null);
  protected readonly progress = signal<{ loaded: number; total: number } | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly latest = signal<UploadDetail | null>(null);
  protected readonly loadingLatest = signal(false);
  protected referenceDbm: number | null = null;
  protected sampleRateHz: number | null = null;
  protected fullScaleDbm: number | null = null;
  private transfer: Subscription | null = null;

  protected readonly dropTitle = computed(() => {
    const a = this.accepts();
    return `Drop the ${a.length === 2 ? 'trace or capture' : a[0] === 'trace' ? 'analyzer trace' : 'I/Q capture'} here`;
  });
  protected readonly dropHint = computed(() =>
    [this.accepts().includes('trace') ? 'Trace CSV with a frequency and a level column.' : '', this.accepts().includes('iq') ? 'SigMF pair (.sigmf-meta + .sigmf-data), WAV, or raw .cf32/.ci16 with its sample rate.' : ''].filter(Boolean).join(' '),
  );
  protected readonly percent = computed(() => {
    const p = this.progress();
    return p && p.total > 0 ? Math.round((100 * p.loaded) / p.total) : 0;
  });
  protected readonly needsReference = computed(() => this.kind() === 'emission-mask' && this.plan()?.ok === true);
  protected readonly needsRate = computed(() => {
    const p = this.plan();
    return p?.ok === true && p.needsSampleRate;
  });
  protected readonly isIq = computed(() => {
    const p = this.plan();
    return p?.ok === true && p.evidence === 'iq';
  });

  constructor() {
    effect(() => {
      const id = this.latestUploadId();
      if (id && id !== untracked(() => this.latest()?.id)) this.loadLatest(id);
    });
  }

  async choose(files: File[]): Promise<void> {
    this.files.set(files);
    this.error.set(null);
    this.notice.set(null);
    if (!files.length) return this.plan.set(null);
    const chosen = await Promise.all(files.map(async (f) => ({ name: f.name, firstBytes: new Uint8Array(await f.slice(0, 512).arrayBuffer()) })));
    this.plan.set(uploadPlan(chosen, this.accepts()));
  }

  send(): void {
    const plan = this.plan();
    if (!plan?.ok) return;
    const files = plan.order.map((i) => this.files()[i]);
    const parts: UploadParts = { file: files[0], ...(files[1] && { data: files[1] }) };
    const fields: UploadFields = {
      format: plan.format,
      ...(this.needsReference() && this.referenceDbm !== null && { referenceDbm: this.referenceDbm }),
      ...(this.needsRate() && this.sampleRateHz !== null && { sampleRateHz: this.sampleRateHz }),
      ...(this.isIq() && this.fullScaleDbm !== null && { fullScaleDbm: this.fullScaleDbm }),
    };
    this.error.set(null);
    this.notice.set(null);
    this.progress.set({ loaded: 0, total: files.reduce((n, f) => n + f.size, 0) });
    this.transfer = this.api.upload(this.runId(), this.caseId(), parts, fields).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress) this.progress.set({ loaded: event.loaded, total: event.total ?? this.progress()?.total ?? 0 });
        if (event.type === HttpEventType.Response && event.body) {
          this.latest.set(event.body);
          this.finish();
          this.files.set([]);
          this.plan.set(null);
          this.uploaded.emit(event.body);
        }
      },
      error: (e) => {
        this.error.set(problemMessage(e));
        this.finish();
      },
    });
  }

  /** Unsubscribing aborts the request: the browser stops sending and the server stores nothing. */
  cancel(): void {
    this.transfer?.unsubscribe();
    this.finish();
    this.notice.set('Upload cancelled. Nothing was stored.');
  }

  private finish(): void {
    this.transfer = null;
    this.progress.set(null);
  }

  private loadLatest(uploadId: string): void {
    this.loadingLatest.set(true);
    this.api.get(uploadId).subscribe({
      next: (detail) => {
        this.latest.set(detail);
        this.loadingLatest.set(false);
      },
      error: (e) => {
        this.error.set(problemMessage(e));
        this.loadingLatest.set(false);
      },
    });
  }
}
