import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { RunState } from '../../../shared/runs/run-state';
import type { TestKind } from '../../../shared/rules/test-kind';
import type { RuleSetBody } from '../../../shared/rules/rule-set';
import type { UploadResult, UploadSummary } from './uploads-api';

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export interface RunRow {
  id: string;
  number: string;
  state: RunState;
  updatedAt: string;
  planName: string;
  manufacturer: string;
  model: string;
  serialNumber: string;
  client: string;
}

/** One row of a stored uncertainty budget (GUM: u_i, |c_i|·u_i and its share of u_c²). */
export interface BudgetRow {
  name: string;
  standard: number;
  contribution: number;
  varianceShare: number;
}

/** What the server keeps beside a result (server/runs/run-service.ts saveReading). */
export interface StoredResultDetail {
  limitText?: string;
  direction?: 'at-least' | 'at-most';
  decisionRuleText?: string;
  budget?: BudgetRow[];
  inputs?: Record<string, unknown>;
  combinedStandard?: number;
  instruments?: { id: string; name: string; serialNumber: string; calibrationDue: string; certificateRef: string }[];
}

export interface StoredResult {
  id: string;
  readingId: string;
  engineVersion: string;
  value: number | null;
  unit: string;
  limit: number | null;
  margin: number | null;
  expandedUncertainty: number | null;
  coverageFactor: number | null;
  verdict: string;
  detail: StoredResultDetail & Record<string, unknown>;
  createdAt: string;
}

export interface RunInstrument {
  id: string;
  name: string;
  model: string;
  serialNumber: string;
  calibratedOn: string;
  calibrationDue: string;
  calibrationStatus: 'valid' | 'due-soon' | 'overdue';
  certificateRef: string;
}

export interface RunCase {
  id: string;
  position: number;
  kind: TestKind;
  label: string;
  parameters: { frequencyHz?: number; sideband?: string; powerLevel?: string | null };
  reading: { id: string; values: Record<string, number | string | null>; enteredBy?: string | null; createdAt: string } | null;
  result: StoredResult | null;
  /** Files uploaded for the case, newest first (server/uploads). */
  uploads?: UploadSummary[];
  /** The latest result computed from an uploaded trace or capture. */
  traceResult?: UploadResult | null;
}

export interface RunDetail {
  id: string;
  number: string;
  state: RunState;
  engineerId: string | null;
  reviewerId: string | null;
  returnReason: string | null;
  testedFrom?: string | null;
  testedTo?: string | null;
  instruments?: RunInstrument[];
  plan: { id: string; name: string; ruleSet: RuleSetBody & { name?: string; version?: number } };
  device: { id: string; manufacturer: string; model: string; serialNumber: string; emissionDesignator: string; ratedPepW: number };
  client: { id: string; name: string; contactName: string; contactEmail: string };
  testCases: RunCase[];
}

export interface SavedReading {
  reading: { id: string; values: Record<string, unknown>; createdAt: string };
  result: StoredResult | null;
  problem: string | null;
}

/** Typed access to /api/runs. */
@Injectable({ providedIn: 'root' })
export class RunsApi {
  private readonly http = inject(HttpClient);

  list(query: { page?: number; pageSize?: number; sort?: string; state?: string; search?: string }): Observable<Page<RunRow>> {
    let params = new HttpParams();
    for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== '') params = params.set(k, String(v));
    return this.http.get<Page<RunRow>>('/api/runs', { params });
  }

  get(id: string): Observable<RunDetail> {
    return this.http.get<RunDetail>(`/api/runs/${encodeURIComponent(id)}`);
  }

  create(planId: string): Observable<RunDetail> {
    return this.http.post<RunDetail>('/api/runs', { planId });
  }

  saveReading(runId: string, caseId: string, values: Record<string, number | string | null>): Observable<SavedReading> {
    return this.http.put<SavedReading>(`/api/runs/${encodeURIComponent(runId)}/cases/${encodeURIComponent(caseId)}/reading`, { values });
  }

  act(runId: string, action: 'submit' | 'approve' | 'return' | 'issue', reason?: string): Observable<unknown> {
    return this.http.post(`/api/runs/${encodeURIComponent(runId)}/${action}`, reason ? { reason } : {});
  }

  /** The whole set of instruments used on the run; the server refuses one past its calibration. */
  setInstruments(runId: string, instrumentIds: string[]): Observable<RunDetail> {
    return this.http.put<RunDetail>(`/api/runs/${encodeURIComponent(runId)}/instruments`, { instrumentIds });
  }
}
