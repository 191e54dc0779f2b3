import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CreditAdjustmentBody, CreditCurrency, PriceListBody } from '../../../shared/schemas/billing';
import type { Page } from '../runs/runs-api';
import { listParams } from '../settings/list-params';

/** The lab's price list as GET/PUT /api/billing/price-list answer it (server/billing/price-list.ts). */
export interface PriceList {
  configured: boolean;
  currency: CreditCurrency | null;
  packs: { id: string; credits: number; priceMinor: number; currency: string; pricePerCreditMinor: number }[];
  refundOnWithdrawWithinDays: number | null;
  updatedAt: string | null;
}

/** One client's credits at the lab (server/billing/sales-overview.ts). */
export interface ClientBalance {
  clientId: string;
  name: string;
  invoiceLater: boolean;
  balance: number;
  purchased: number;
  consumed: number;
  refunded: number;
  adjusted: number;
  lastActivityAt: string | null;
}

export interface SalesOverview {
  /** Completed purchases per currency. */
  totals: { currency: string; completedPurchases: number; revenueMinor: number; creditsSold: number; pendingPurchases: number }[];
  clients: Page<ClientBalance>;
}

/** A row of the credit ledger with the balance after it (server/billing/list-ledger.ts). */
export interface LedgerEntry {
  id: string;
  kind: 'purchase' | 'consumption' | 'refund' | 'adjustment';
  credits: number;
  reason: string | null;
  reportId: string | null;
  reportNumber: string | null;
  purchaseId: string | null;
  createdByName: string | null;
  lab: { id: string; name: string };
  client: { id: string; name: string };
  balanceAfter: number;
  createdAt: string;
}

/** The answer of POST /api/billing/adjustments: the new row and the client's new balance. */
export interface Adjustment {
  id: string;
  clientId: string;
  kind: 'adjustment';
  credits: number;
  reason: string;
  createdAt: string;
  balance: number;
}

/** Typed access to the lab's side of billing: sales, price list, adjustments and the ledger (server/billing/routes.ts). */
@Injectable({ providedIn: 'root' })
export class LabBillingApi {
  private readonly http = inject(HttpClient);

  sales(query: { page?: number; pageSize?: number; search?: string; sort?: string } = {}): Observable<SalesOverview> {
    return this.http.get<SalesOverview>('/api/billing/sales', { params: listParams(query) });
  }

  priceList(): Observable<PriceList> {
    return this.http.get<PriceList>('/api/billing/price-list');
  }

  savePriceList(body: PriceListBody): Observable<PriceList> {
    return this.http.put<PriceList>('/api/billing/price-list', body);
  }

  adjust(body: CreditAdjustmentBody): Observable<Adjustment> {
    return this.http.post<Adjustment>('/api/billing/adjustments', body);
  }

  /** One client's statement, newest first. */
  ledger(clientId: string, query: { page?: number; pageSize?: number } = {}): Observable<Page<LedgerEntry>> {
    return this.http.get<Page<LedgerEntry>>('/api/billing/ledger', { params: listParams({ clientId, sort: '-createdAt', ...query }) });
  }
}
