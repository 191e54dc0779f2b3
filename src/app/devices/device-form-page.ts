import { ChangeDetectionStrategy, Component, OnInit, computed, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { DevicesApi, type ClientRow } from './devices-api';
import type { CreateDeviceBody } from '../../../shared/schemas/records';
import { problemMessage } from '../session/problem-message';
import { clearServerErrors, showProblemOnForm } from '../session/show-problem-on-form';
import { parseEmissionDesignator } from '../../../shared/bandwidth/emission-designator';

function designator(control: AbstractControl): ValidationErrors | null {
  if (!control.value) return null;
  try {
    parseEmissionDesignator(String(control.value).toUpperCase());
    return null;
  } catch (error) {
    // The engine's message starts with its function's name, which means nothing to the person typing.
    return { designator: (error as Error).message.replace(/^parseEmissionDesignator: /, '') };
  }
}

@Component({
  selector: 'sc-device-form-page',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, MatSelectModule, MatCheckboxModule, MatProgressBarModule],
  templateUrl: './device-form-page.html',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeviceFormPage implements OnInit {
  private readonly api = inject(DevicesApi);
  private readonly router = inject(Router);

  /** Present when changing a registered device (/devices/:id/edit). */
  readonly id = input<string>();

  protected readonly editing = computed(() => !!this.id());
  protected readonly loading = signal(false);
  protected readonly clients = signal<ClientRow[]>([]);
  protected readonly busy = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly form = inject(NonNullableFormBuilder).group({
    clientId: ['', Validators.required],
    manufacturer: ['', [Validators.required, Validators.maxLength(200)]],
    model: ['', [Validators.required, Validators.maxLength(200)]],
    serialNumber: ['', [Validators.required, Validators.maxLength(100)]],
    firmware: [''],
    ratedPepW: [100, [Validators.required, Validators.min(0.001), Validators.max(1e6)]],
    emissionDesignator: ['2K70J3E', [Validators.required, designator]],
    frequencyMinMHz: [1.6, [Validators.required, Validators.min(0)]],
    frequencyMaxMHz: [27.5, [Validators.required, Validators.min(0)]],
    usb: [true],
    lsb: [false],
    receivedOn: [new Date().toISOString().slice(0, 10), Validators.required],
    condition: ['As received, no visible damage'],
  });

  constructor() {
    this.api.clients().subscribe({
      next: (page) => {
        this.clients.set(page.items);
        if (page.items.length === 1) this.form.controls.clientId.setValue(page.items[0].id);
      },
      error: (error) => this.error.set(problemMessage(error)),
    });
  }

  ngOnInit(): void {
    const id = this.id();
    if (!id) return;
    this.loading.set(true);
    this.api.get(id).subscribe({
      next: (d) => {
        this.form.setValue({
          clientId: d.clientId,
          manufacturer: d.manufacturer,
          model: d.model,
          serialNumber: d.serialNumber,
          firmware: d.firmware ?? '',
          ratedPepW: d.ratedPepW,
          emissionDesignator: d.emissionDesignator,
          frequencyMinMHz: d.frequencyMinHz / 1e6,
          frequencyMaxMHz: d.frequencyMaxHz / 1e6,
          usb: d.modes.includes('USB'),
          lsb: d.modes.includes('LSB'),
          receivedOn: d.receivedOn,
          condition: d.condition ?? '',
        });
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }

  save(): void {
    clearServerErrors(this.form);
    const v = this.form.getRawValue();
    const modes = [...(v.usb ? ['USB' as const] : []), ...(v.lsb ? ['LSB' as const] : [])];
    if (this.form.invalid || modes.length === 0) {
      this.form.markAllAsTouched();
      if (modes.length === 0) this.error.set('Choose at least one sideband (USB or LSB).');
      return;
    }
    this.busy.set(true);
    this.error.set(null);
    const id = this.id();
    const body: CreateDeviceBody = {
      clientId: v.clientId,
      manufacturer: v.manufacturer.trim(),
      model: v.model.trim(),
      serialNumber: v.serialNumber.trim(),
      firmware: v.firmware.trim() || undefined,
      ratedPepW: Number(v.ratedPepW),
      emissionDesignator: v.emissionDesignator.toUpperCase(),
      frequencyMinHz: Math.round(Number(v.frequencyMinMHz) * 1e6),
      frequencyMaxHz: Math.round(Number(v.frequencyMaxMHz) * 1e6),
      modes,
      receivedOn: v.receivedOn,
      condition: v.condition.trim(),
    };
    (id ? this.api.update(id, body) : this.api.create(body)).subscribe({
      next: (device) => void (id ? this.router.navigate(['/devices']) : this.router.navigate(['/plans/new'], { queryParams: { deviceId: device.id } })),
      error: (error) => {
        this.error.set(showProblemOnForm(this.form, error, { frequencyMinHz: 'frequencyMinMHz', frequencyMaxHz: 'frequencyMaxMHz' }));
        this.busy.set(false);
      },
    });
  }
}
