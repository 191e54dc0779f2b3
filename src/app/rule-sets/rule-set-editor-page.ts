import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { DatePipe } from '@angular/common';
import { ReactiveFormsModule } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { map, of, startWith, switchMap } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { SessionStore } from '../session/session-store';
import { problemMessage } from '../session/problem-message';
import { clearServerErrors, showProblemOnForm } from '../session/show-problem-on-form';
import { SCREEN_ROLES } from '../accounts/screen-roles';
import { describeDecisionRule } from '../../../shared/uncertainty/describe-decision-rule';
import type { DecisionRule } from '../../../shared/uncertainty/decision-rule';
import { CopyRuleSet } from './copy-rule-set';
import { MaskVertexEditor } from './mask-vertex-editor';
import { RuleSetsApi, type RuleSet } from './rule-sets-api';
import { editedBody, ruleSetForm, type LimitGroup, type RuleSetForm } from './rule-set-form';

const LIMIT_TITLES: Partial<Record<string, string>> = {
  carrierSuppression: 'Carrier suppression',
  unwantedSideband: 'Unwanted sideband',
  intermodulation: 'Intermodulation',
  spurious: 'Spurious emissions',
  occupiedBandwidth: 'Occupied bandwidth',
  frequencyTolerance: 'Frequency tolerance',
  audioResponse: 'Audio response',
};

/**
 * One rule set (/rule-sets/:id). A built-in sample is shown read-only with its notice and a copy
 * button; the lab's own is edited here, and saving stores a new version (the one edited never
 * changes, nor do plans made from it).
 */
@Component({
  selector: 'sc-rule-set-editor-page',
  imports: [DatePipe, ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule, MaskVertexEditor],
  templateUrl: './rule-set-editor-page.html',
  styleUrl: './rule-set-editor-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RuleSetEditorPage {
  private readonly api = inject(RuleSetsApi);
  private readonly copier = inject(CopyRuleSet);
  private readonly router = inject(Router);
  private readonly session = inject(SessionStore);

  readonly id = input.required<string>();

  protected readonly limitTitles = LIMIT_TITLES;
  protected readonly ruleSet = signal<RuleSet | null>(null);
  protected readonly versions = signal<RuleSet[]>([]);
  protected readonly form = signal<RuleSetForm | null>(null);
  protected readonly groups = signal<LimitGroup[]>([]);
  protected readonly hasMask = signal(false);
  protected readonly loading = signal(true);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly canWrite = this.session.hasRole(...SCREEN_ROLES.labRecordsWrite);
  protected readonly editable = computed(() => this.canWrite && !!this.ruleSet() && !this.ruleSet()!.builtIn && this.isLatest());
  protected readonly isLatest = computed(() => {
    const r = this.ruleSet();
    return !!r && this.versions().every((v) => v.version <= r.version);
  });
  private readonly formValue = toSignal(
    toObservable(this.form).pipe(switchMap((f) => (f ? f.valueChanges.pipe(map(() => f.getRawValue()), startWith(f.getRawValue())) : of(null)))),
    { initialValue: null },
  );
  protected readonly decisionText = computed(() => {
    const v = this.formValue();
    if (!v) return '';
    const rule: DecisionRule = v.decisionKind === 'simple-acceptance' ? { kind: 'simple-acceptance' } : { kind: v.decisionKind, guardBand: v.guardBandMode === 'fixed' ? Number(v.guardBandDb) : 'expanded-uncertainty' };
    return describeDecisionRule(rule);
  });

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => this.load(id));
    });
  }

  load(id = this.id()): void {
    this.loading.set(true);
    this.error.set(null);
    this.notice.set((history.state as { notice?: string } | null)?.notice ?? null);
    this.api.get(id).subscribe({
      next: (r) => {
        const built = ruleSetForm(r.name, r.body);
        this.ruleSet.set(r);
        this.groups.set(built.groups);
        this.hasMask.set(built.hasMask);
        this.form.set(built.form);
        this.loading.set(false);
        if (r.builtIn || !this.canWrite) built.form.disable();
        if (!r.builtIn) this.loadVersions(r);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }

  private loadVersions(r: RuleSet): void {
    this.api.list({ key: r.key, latest: false }).subscribe({
      next: (page) => {
        this.versions.set(page.items.filter((v) => !v.builtIn).sort((a, b) => b.version - a.version));
        if (!this.isLatest()) this.form()?.disable();
      },
      error: () => this.versions.set([]),
    });
  }

  async copy(): Promise<void> {
    const r = this.ruleSet();
    if (!r) return;
    try {
      await this.copier.copy(r);
    } catch (error) {
      this.error.set(problemMessage(error));
    }
  }

  save(): void {
    const r = this.ruleSet();
    const form = this.form();
    if (!r || !form) return;
    clearServerErrors(form);
    if (form.invalid) {
      form.markAllAsTouched();
      this.error.set('Some fields need attention: see the messages beside them.');
      return;
    }
    const body = editedBody(r.body, form);
    if (!body) {
      this.error.set('The emission mask has problems: see the marked vertices.');
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    this.api.saveVersion(r.id, { name: form.controls.name.value.trim(), body }).subscribe({
      next: (saved) => {
        this.busy.set(false);
        void this.router.navigate(['/rule-sets', saved.id], {
          replaceUrl: true,
          state: { notice: `Saved as version ${saved.version}. Version ${r.version} stays as it was, and plans made from it keep it.` },
        });
      },
      error: (error) => {
        this.busy.set(false);
        // The name is the one field the body names at the same place as the form; the rest stays in the banner.
        this.error.set(showProblemOnForm(form, error));
      },
    });
  }
}
