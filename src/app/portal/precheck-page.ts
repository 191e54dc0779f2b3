import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { DecimalPipe } from '@angular/common';
import { HttpEventType } from '@angular/common/http';
import { FormsModule } from '@angular/forms';
import type { Subscription } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { PRECHECK_NOTICE, type PrecheckFields } from '../../../shared/schemas/uploads';
import { PrecheckApi, type PrecheckAnswer, type PrecheckCheck, type SampleRuleSet } from './precheck-api';
import { FileDrop } from '../runs/file-drop';
import { PhasingDiagnosis } from '../runs/phasing-diagnosis';
import { uploadPlan, type UploadPlan } from '../runs/upload-plan';
import { uploadChartData } from '../runs/upload-chart-data';
import { SpectrumChart } from '../ui/spectrum-chart';
import { VerdictChip } from '../ui/verdict-chip';
import { problemMessage } from '../session/problem-message';

type Judged = Extract<PrecheckCheck, { verdict: string }>;

/**
 * The manufacturer's engineering pre-check: their own trace or capture, analysed with the lab's
 * engine against a built-in sample rule set, every margin, the spectrum chart and the phasing
 * diagnosis. Nothing is stored, and every screen of it says it is not an accredited result.
 */
@Component({
  selector: 'sc-precheck-page',
  imports: [DecimalPipe, FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, FileDrop, PhasingDiagnosis, SpectrumChart, VerdictChip],
  templateUrl: './precheck-page.html',
  styleUrl: './precheck-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PrecheckPage {
  private readonly api = inject(PrecheckApi);

  protected readonly notice = PRECHECK_NOTICE;
  protected readonly ruleSets = signal<SampleRuleSet[] | null>(null);
  protected readonly ruleSetsError = signal<string | null>(null);
  protected readonly files = signal<File[]>([]);
  protected readonly plan = signal<UploadPlan | null>(null);
  protected readonly progress = signal<{ loaded: number; total: number } | null>(null);
  protected readonly error = signal<string | null>(null);
  protected readonly answer = signal<PrecheckAnswer | null>(null);
  protected ruleSetId = '';
  protected carrierKhz: number | null = null;
  protected referenceDbm: number | null = null;
  protected sampleRateHz: number | null = null;
  protected fullScaleDbm: number | null = null;
  protected sideband: 'usb' | 'lsb' | 'auto' = 'auto';
  private transfer: Subscription | null = null;

  protected readonly isTrace = computed(() => {
    const p = this.plan();
    return p?.ok === true && p.evidence === 'trace';
  });
  protected readonly needsRate = computed(() => {
    const p = this.plan();
    return p?.ok === true && p.needsSampleRate;
  });
  protected readonly percent = computed(() => {
    const p = this.progress();
    return p && p.total > 0 ? Math.round((100 * p.loaded) / p.total) : 0;
  });
  protected readonly judged = computed(() => (this.answer()?.checks ?? []).filter((c): c is Judged => 'verdict' in c));
  protected readonly refused = computed(() => (this.answer()?.checks ?? []).filter((c): c is Extract<PrecheckCheck, { problem: string }> => 'problem' in c));
  protected readonly maskCheck = computed(() => this.judged().find((c) => c.mask) ?? null);
  protected readonly chart = computed(() => {
    const a = this.answer();
    if (!a) return null;
    const m = this.maskCheck();
    return uploadChartData(a.analysis, m?.mask ?? null, m ? m.value : null);
  });
  protected readonly usbRequired = computed(() => this.judged().find((c) => c.kind === 'unwanted-sideband')?.limit ?? null);
  protected readonly usbMeasured = computed(() => {
    const a = this.answer()?.analysis;
    return a?.source === 'iq' ? a.figures.unwantedSidebandSuppressionDb : null;
  });

  constructor() {
    this.api.sampleRuleSets().subscribe({
      next: (r) => {
        this.ruleSets.set(r.items);
        this.ruleSetId ||= r.items[0]?.id ?? '';
      },
      error: (e) => this.ruleSetsError.set(problemMessage(e)),
    });
  }

  async choose(files: File[]): Promise<void> {
    this.files.set(files);
    this.error.set(null);
    if (!files.length) return this.plan.set(null);
    const chosen = await Promise.all(files.map(async (f) => ({ name: f.name, firstBytes: new Uint8Array(await f.slice(0, 512).arrayBuffer()) })));
    this.plan.set(uploadPlan(chosen, ['trace', 'iq']));
  }

  run(): void {
    const plan = this.plan();
    if (!plan?.ok || !this.ruleSetId) return;
    const files = plan.order.map((i) => this.files()[i]);
    const fields: PrecheckFields = {
      ruleSetId: this.ruleSetId,
      format: plan.format,
      ...(this.carrierKhz !== null && { centerHz: Math.round(this.carrierKhz * 1000 * 1000) / 1000 }),
      ...(this.isTrace() && this.referenceDbm !== null && { referenceDbm: this.referenceDbm }),
      ...(this.needsRate() && this.sampleRateHz !== null && { sampleRateHz: this.sampleRateHz }),
      ...(!this.isTrace() && this.fullScaleDbm !== null && { fullScaleDbm: this.fullScaleDbm }),
      ...(this.isTrace() ? (this.sideband !== 'auto' && { sideband: this.sideband }) : { sideband: this.sideband }),
    };
    this.error.set(null);
    this.answer.set(null);
    this.progress.set({ loaded: 0, total: files.reduce((n, f) => n + f.size, 0) });
    this.transfer = this.api.run({ file: files[0], ...(files[1] && { data: files[1] }) }, fields).subscribe({
      next: (event) => {
        if (event.type === HttpEventType.UploadProgress) this.progress.set({ loaded: event.loaded, total: event.total ?? this.progress()?.total ?? 0 });
        if (event.type === HttpEventType.Response && event.body) {
          this.answer.set(event.body);
          this.done();
        }
      },
      error: (e) => {
        this.error.set(problemMessage(e));
        this.done();
      },
    });
  }

  cancel(): void {
    this.transfer?.unsubscribe();
    this.done();
    this.error.set('Pre-check cancelled.');
  }

  private done(): void {
    this.transfer = null;
    this.progress.set(null);
  }
}
