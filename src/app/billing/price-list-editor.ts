import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormArray, FormControl, FormGroup, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { CREDIT_CURRENCIES, MAX_PACK_CREDITS, MAX_PACKS, type CreditCurrency, type PriceListBody } from '../../../shared/schemas/billing';
import { LabBillingApi, type PriceList } from './billing-api';
import { toMajorText, toMinorUnits } from './minor-units';
import { problemMessage } from '../session/problem-message';

type PackForm = FormGroup<{ credits: FormControl<string>; price: FormControl<string> }>;

/** Pack sizes offered when a lab writes its first price list (common practice: a single report, a small and a large pack). */
const STARTER_SIZES = [1, 5, 20];

/**
 * The lab's price list: the currency, packs of credits by size with their price, and how long a
 * withdrawn report's credit is refunded. Saving replaces the whole list (PUT /api/billing/price-list).
 */
@Component({
  selector: 'sc-price-list-editor',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule, MatSelectModule],
  templateUrl: './price-list-editor.html',
  styleUrl: './price-list-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PriceListEditor {
  private readonly api = inject(LabBillingApi);

  protected readonly currencies = CREDIT_CURRENCIES;
  protected readonly maxPacks = MAX_PACKS;
  protected readonly loaded = signal<PriceList | null>(null);
  protected readonly loading = signal(true);
  protected readonly saving = signal(false);
  protected readonly error = signal<string | null>(null);
  protected readonly saveError = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);

  protected readonly form = new FormGroup({
    currency: new FormControl<CreditCurrency>('GBP', { nonNullable: true }),
    packs: new FormArray<PackForm>([], { validators: [distinctSizes] }),
    refundDays: new FormControl('', { nonNullable: true, validators: [Validators.pattern(/^\s*(\d{1,3})?\s*$/), maxValue(365)] }),
  });

  constructor() {
    const sub = this.form.controls.currency.valueChanges.subscribe(() => this.form.controls.packs.controls.forEach((p) => p.controls.price.updateValueAndValidity()));
    inject(DestroyRef).onDestroy(() => sub.unsubscribe());
    this.load();
  }

  get packs(): FormArray<PackForm> {
    return this.form.controls.packs;
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.priceList().subscribe({
      next: (list) => {
        this.fill(list);
        this.loading.set(false);
      },
      error: (e) => {
        this.error.set(problemMessage(e));
        this.loading.set(false);
      },
    });
  }

  addPack(): void {
    this.packs.push(this.packForm('', ''));
  }

  removePack(index: number): void {
    this.packs.removeAt(index);
  }

  save(): void {
    this.notice.set(null);
    this.saveError.set(null);
    this.form.markAllAsTouched();
    if (this.form.invalid || this.packs.length === 0) {
      if (this.packs.length === 0) this.saveError.set('Add at least one pack.');
      return;
    }
    const currency = this.form.controls.currency.value;
    const refund = this.form.controls.refundDays.value.trim();
    const body: PriceListBody = {
      currency,
      packs: this.packs.controls.map((p) => ({ credits: Number(p.controls.credits.value), priceMinor: toMinorUnits(p.controls.price.value, currency)! })),
      ...(refund === '' ? {} : { refundOnWithdrawWithinDays: Number(refund) }),
    };
    this.saving.set(true);
    this.api.savePriceList(body).subscribe({
      next: (list) => {
        this.fill(list);
        this.saving.set(false);
        this.notice.set('Price list saved. Clients see the new packs at once.');
      },
      error: (e) => {
        this.saveError.set(problemMessage(e));
        this.saving.set(false);
      },
    });
  }

  private fill(list: PriceList): void {
    this.loaded.set(list);
    const currency = list.currency ?? 'GBP';
    this.form.controls.currency.setValue(currency, { emitEvent: false });
    this.packs.clear();
    const packs = list.configured ? list.packs.map((p) => this.packForm(String(p.credits), toMajorText(p.priceMinor, currency))) : STARTER_SIZES.map((n) => this.packForm(String(n), ''));
    packs.forEach((p) => this.packs.push(p));
    this.form.controls.refundDays.setValue(list.refundOnWithdrawWithinDays === null ? '' : String(list.refundOnWithdrawWithinDays));
    this.form.markAsPristine();
    this.form.markAsUntouched();
  }

  private packForm(credits: string, price: string): PackForm {
    return new FormGroup({
      credits: new FormControl(credits, { nonNullable: true, validators: [Validators.required, Validators.pattern(/^\s*[1-9]\d{0,3}\s*$/), maxValue(MAX_PACK_CREDITS)] }),
      price: new FormControl(price, { nonNullable: true, validators: [Validators.required, (c: AbstractControl) => (toMinorUnits(String(c.value), this.form?.controls.currency.value ?? 'GBP') === null ? { price: true } : null)] }),
    });
  }
}

function maxValue(max: number) {
  return (c: AbstractControl): ValidationErrors | null => (String(c.value).trim() !== '' && Number(c.value) > max ? { max: true } : null);
}

/** One pack per size, as the server requires (server/billing/price-list.ts). */
function distinctSizes(array: AbstractControl): ValidationErrors | null {
  const sizes = (array as FormArray<PackForm>).controls.map((p) => Number(p.controls.credits.value));
  return sizes.some((n, i) => n > 0 && sizes.indexOf(n) !== i) ? { duplicateSize: true } : null;
}
