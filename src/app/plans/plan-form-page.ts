import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { forkJoin, switchMap } from 'rxjs';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { PlansApi, type RuleSetRow } from './plans-api';
import { DevicesApi, type DeviceRow } from '../devices/devices-api';
import { RunsApi } from '../runs/runs-api';
import { problemMessage } from '../session/problem-message';
import { clearServerErrors, showProblemOnForm } from '../session/show-problem-on-form';
import { TEST_KINDS, TEST_KIND_LABELS, type TestKind } from '../../../shared/rules/test-kind';

/** Build a test plan for a device (/plans/new?deviceId=…) from its rule set and test points, then start a run from it. */
@Component({
  selector: 'sc-plan-form-page',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatIconModule, MatProgressBarModule],
  templateUrl: './plan-form-page.html',
  styleUrl: './plan-form-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlanFormPage {
  private readonly plans = inject(PlansApi);
  private readonly devices = inject(DevicesApi);
  private readonly runs = inject(RunsApi);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly kinds = TEST_KINDS;
  protected readonly kindLabels = TEST_KIND_LABELS;
  protected readonly deviceList = signal<DeviceRow[]>([]);
  protected readonly ruleSets = signal<RuleSetRow[]>([]);
  /** The devices and rule sets the selects offer are being fetched. */
  protected readonly loading = signal(true);
  /** Saving is offered only once both lists were read. */
  protected readonly loaded = signal(false);
  protected readonly loadError = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly form = this.fb.group({
    deviceId: [inject(ActivatedRoute).snapshot.queryParamMap.get('deviceId') ?? '', Validators.required],
    ruleSetId: ['', Validators.required],
    name: ['Type test', [Validators.required, Validators.maxLength(200)]],
    testPoints: this.fb.array([this.point('carrier-suppression', '2182 kHz, full power', 2.182)]),
  });

  constructor() {
    this.load();
  }

  /** Fetches the lab's devices and the rule sets (latest versions) together; again after a failure. */
  load(): void {
    this.loading.set(true);
    this.loadError.set(null);
    forkJoin({ devices: this.devices.list({ pageSize: 200 }), ruleSets: this.plans.ruleSets() }).subscribe({
      next: ({ devices, ruleSets }) => {
        this.deviceList.set(devices.items);
        this.ruleSets.set(ruleSets.items);
        const items = ruleSets.items;
        if (!this.form.controls.ruleSetId.value && items[0]) this.form.controls.ruleSetId.setValue(items.find((x) => x.body.service === 'maritime')?.id ?? items[0].id);
        this.loading.set(false);
        this.loaded.set(true);
      },
      error: (e) => {
        this.loadError.set(problemMessage(e));
        this.loading.set(false);
      },
    });
  }

  private point(kind: TestKind, label: string, frequencyMHz: number) {
    return this.fb.group({
      kind: [kind as string, Validators.required],
      label: [label, [Validators.required, Validators.maxLength(200)]],
      frequencyMHz: [frequencyMHz, [Validators.required, Validators.min(0.001)]],
      sideband: ['USB', Validators.required],
    });
  }

  addPoint(): void {
    this.form.controls.testPoints.push(this.point('carrier-suppression', '', 8.291));
  }

  removePoint(index: number): void {
    this.form.controls.testPoints.removeAt(index);
  }

  selectedRuleSet(): RuleSetRow | undefined {
    return this.ruleSets().find((r) => r.id === this.form.controls.ruleSetId.value);
  }

  saveAndStart(): void {
    if (!this.loaded()) return;
    clearServerErrors(this.form);
    if (this.form.invalid || this.form.controls.testPoints.length === 0) {
      this.form.markAllAsTouched();
      return;
    }
    const v = this.form.getRawValue();
    this.busy.set(true);
    this.error.set(null);
    this.plans
      .create({
        deviceId: v.deviceId,
        ruleSetId: v.ruleSetId,
        name: v.name.trim(),
        testPoints: v.testPoints.map((p) => ({ kind: p.kind as TestKind, label: p.label.trim(), frequencyHz: Math.round(Number(p.frequencyMHz) * 1e6), sideband: p.sideband as 'USB' | 'LSB' })),
      })
      .pipe(switchMap((plan) => this.runs.create(plan.id)))
      .subscribe({
        next: (run) => void this.router.navigate(['/runs', run.id]),
        error: (error) => {
          this.error.set(showProblemOnForm(this.form, error, { frequencyHz: 'frequencyMHz' }));
          this.busy.set(false);
        },
      });
  }
}
