import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { PriceListEditor } from './price-list-editor';
import type { PriceList } from './billing-api';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

const saved: PriceList = {
  configured: true,
  currency: 'GBP',
  packs: [
    { id: 'pack-1', credits: 1, priceMinor: 18000, currency: 'GBP', pricePerCreditMinor: 18000 },
    { id: 'pack-5', credits: 5, priceMinor: 80000, currency: 'GBP', pricePerCreditMinor: 16000 },
  ],
  refundOnWithdrawWithinDays: 30,
  updatedAt: '2026-12-01T09:00:00Z',
};

describe('PriceListEditor', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  async function render(list: PriceList) {
    const fixture = TestBed.createComponent(PriceListEditor);
    await fixture.whenStable();
    http.expectOne('/api/billing/price-list').flush(list);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const input = (label: string) => el.querySelector(`input[aria-label="${label}"]`) as HTMLInputElement;
    const type = async (label: string, value: string) => {
      input(label).value = value;
      input(label).dispatchEvent(new Event('input'));
      await fixture.whenStable();
    };
    const submit = async () => {
      (el.querySelector('button[type="submit"]') as HTMLButtonElement).click();
      await fixture.whenStable();
    };
    return { fixture, el, input, type, submit };
  }

  it('shows the saved packs in major units and saves a changed price as whole minor units', async () => {
    const { el, input, type, submit, fixture } = await render(saved);
    expect(input('Price (GBP), pack 1').value).toBe('180.00');
    expect(input('Credits, pack 2').value).toBe('5');
    await type('Price (GBP), pack 2', '750');
    await submit();
    const req = http.expectOne({ method: 'PUT', url: '/api/billing/price-list' });
    // 750 pounds = 75 000 pence (ISO 4217: GBP has 2 decimals, from memory).
    expect(req.request.body).toEqual({ currency: 'GBP', packs: [{ credits: 1, priceMinor: 18000 }, { credits: 5, priceMinor: 75000 }], refundOnWithdrawWithinDays: 30 });
    req.flush({ ...saved, packs: [saved.packs[0], { ...saved.packs[1], priceMinor: 75000 }] });
    await fixture.whenStable();
    expect(el.querySelector('.sc-notice[role="status"]')!.textContent).toContain('Price list saved');
    expect(input('Price (GBP), pack 2').value).toBe('750.00');
  });

  it('offers packs of 1, 5 and 20 to a lab without a price list, and sends nothing while a price is missing or two packs share a size', async () => {
    const { el, input, type, submit } = await render({ configured: false, currency: null, packs: [], refundOnWithdrawWithinDays: null, updatedAt: null });
    expect(el.textContent).toContain('You do not sell report credits yet');
    expect([1, 2, 3].map((i) => input(`Credits, pack ${i}`).value)).toEqual(['1', '5', '20']);
    await submit();
    http.expectNone('/api/billing/price-list');
    expect(el.textContent).toContain('A price above zero');
    await type('Price (GBP), pack 1', '180');
    await type('Price (GBP), pack 2', '800');
    await type('Price (GBP), pack 3', '2900');
    await type('Credits, pack 3', '5');
    await submit();
    http.expectNone('/api/billing/price-list');
    expect(el.querySelector('.field-error[role="alert"]')!.textContent).toContain('same number of credits');
  });

  it('removes a pack and adds one, keeping each row bound to its own values', async () => {
    const { el, input, type, submit, fixture } = await render(saved);
    (el.querySelector('button[aria-label="Remove pack 1"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    expect(input('Credits, pack 1').value).toBe('5');
    expect(input('Price (GBP), pack 1').value).toBe('800.00');
    (el.querySelector('button.add') as HTMLButtonElement).click();
    await fixture.whenStable();
    await type('Credits, pack 2', '20');
    await type('Price (GBP), pack 2', '2,900');
    await submit();
    const req = http.expectOne({ method: 'PUT', url: '/api/billing/price-list' });
    expect(req.request.body.packs).toEqual([{ credits: 5, priceMinor: 80000 }, { credits: 20, priceMinor: 290000 }]);
    req.flush(saved);
  });

  it('shows the server’s refusal', async () => {
    const { el, submit, fixture } = await render(saved);
    await submit();
    http.expectOne({ method: 'PUT', url: '/api/billing/price-list' }).flush({ title: 'Forbidden', detail: 'You may not change the price list.' }, { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    expect(el.querySelector('.sc-error-banner[role="alert"]')!.textContent).toContain('You may not change the price list.');
  });
});
