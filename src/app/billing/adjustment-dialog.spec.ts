import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { AdjustmentDialog, parseCredits } from './adjustment-dialog';
import type { ClientBalance } from './billing-api';

jest.setTimeout(20_000);

const client: ClientBalance = { clientId: 'c1', name: 'Halyard Radio', invoiceLater: false, balance: 3, purchased: 0, consumed: 0, refunded: 0, adjusted: 3, lastActivityAt: null };

describe('parseCredits', () => {
  it.each([
    ['5', 5],
    [' -2 ', -2],
    ['− 3', -3],
    ['1000', 1000],
    ['0', null],
    ['1.5', null],
    ['+', null],
    ['', null],
  ] as const)('"%s" is %p', (text, n) => expect(parseCredits(text)).toBe(n));
});

describe('AdjustmentDialog', () => {
  let http: HttpTestingController;
  const close = jest.fn();
  beforeEach(() => {
    close.mockReset();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MAT_DIALOG_DATA, useValue: client }, { provide: MatDialogRef, useValue: { close } }] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  async function render() {
    const fixture = TestBed.createComponent(AdjustmentDialog);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const set = async (selector: string, value: string) => {
      const field = el.querySelector(selector) as HTMLInputElement | HTMLTextAreaElement;
      field.value = value;
      field.dispatchEvent(new Event('input'));
      await fixture.whenStable();
    };
    const submit = async () => {
      (el.querySelector('button[type="submit"]') as HTMLButtonElement).click();
      await fixture.whenStable();
    };
    return { fixture, el, set, submit };
  }

  it('needs a reason, previews the balance, and closes with the stored adjustment', async () => {
    const { el, set, submit } = await render();
    await set('input', '-2');
    expect(el.querySelector('.after')!.textContent).toContain('Balance after: 1');
    await submit();
    http.expectNone('/api/billing/adjustments');
    expect(el.textContent).toContain('Say why');
    await set('textarea', '  Duplicate purchase refunded by bank transfer ');
    await submit();
    const req = http.expectOne({ method: 'POST', url: '/api/billing/adjustments' });
    expect(req.request.body).toEqual({ clientId: 'c1', credits: -2, reason: 'Duplicate purchase refunded by bank transfer' });
    const stored = { id: 'l1', clientId: 'c1', kind: 'adjustment', credits: -2, reason: 'Duplicate purchase refunded by bank transfer', createdAt: '2026-12-05T10:00:00Z', balance: 1 };
    req.flush(stored);
    expect(close).toHaveBeenCalledWith(stored);
  });

  it('keeps the dialog open with the server’s message when it refuses', async () => {
    const { el, set, submit, fixture } = await render();
    await set('input', '4');
    await set('textarea', 'Goodwill');
    await submit();
    http.expectOne('/api/billing/adjustments').flush({ detail: 'The client does not exist.' }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    expect(el.querySelector('.sc-error-banner[role="alert"]')!.textContent).toContain('The client does not exist.');
    expect(close).not.toHaveBeenCalled();
  });
});
