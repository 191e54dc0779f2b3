import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page } from '../runs/runs-api';

export interface CreditPack {
  id: string;
  credits: number;
  priceMinor: number;
  currency: string;
  pricePerCreditMinor: number;
}

/** The manufacturer's account at one lab (server/billing/manufacturer-accounts.ts). */
export interface CreditAccount {
  lab: { id: string; name: string };
  clientId: string;
  clientName: string;
  invoiceLater: boolean;
  balance: number;
  lastActivityAt: string | null;
}

export interface CreditOffer extends CreditAccount {
  currency: string | null;
  packs: CreditPack[];
}

export interface Purchase {
  id: string;
  lab: { id: string; name: string };
  client: { id: string; name: string };
  packId: string;
  credits: number;
  amountMinor: number;
  currency: string;
  amountText: string;
  status: 'pending' | 'completed' | 'expired' | 'needs-review';
  /** Where the purchase stands, in a sentence for the buyer. */
  message: string;
  receiptNumber: string | null;
  receiptPath: string | null;
  createdAt: string;
  completedAt: string | null;
}

/** Typed access to the manufacturer's side of billing (server/billing/routes.ts). */
@Injectable({ providedIn: 'root' })
export class BillingApi {
  private readonly http = inject(HttpClient);

  balance(): Observable<{ items: CreditAccount[]; totalCredits: number }> {
    return this.http.get<{ items: CreditAccount[]; totalCredits: number }>('/api/billing/balance');
  }

  offers(): Observable<{ items: CreditOffer[] }> {
    return this.http.get<{ items: CreditOffer[] }>('/api/billing/offers');
  }

  /** Opens a checkout at the payment provider; the answer's url is its hosted payment page. */
  checkout(labId: string, packId: string): Observable<{ purchaseId: string; url: string }> {
    return this.http.post<{ purchaseId: string; url: string }>('/api/billing/checkout', { labId, packId });
  }

  purchases(query: { page: number; pageSize: number }): Observable<Page<Purchase>> {
    const params = new HttpParams().set('page', query.page).set('pageSize', query.pageSize).set('sort', '-createdAt');
    return this.http.get<Page<Purchase>>('/api/billing/purchases', { params });
  }

  purchase(id: string): Observable<Purchase> {
    return this.http.get<Purchase>(`/api/billing/purchases/${encodeURIComponent(id)}`);
  }

  receipt(purchase: Purchase): Observable<Blob> {
    return this.http.get(purchase.receiptPath!, { responseType: 'blob' });
  }
}
