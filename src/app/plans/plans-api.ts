import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CreatePlanBody } from '../../../shared/schemas/records';
import type { RuleSetBody } from '../../../shared/rules/rule-set';

export interface RuleSetRow {
  id: string;
  name: string;
  version: number;
  isSample: boolean;
  builtIn: boolean;
  body: RuleSetBody;
}
export interface PlanDetail {
  id: string;
  name: string;
  deviceId: string;
  testCases: { id: string; kind: string; label: string }[];
}

@Injectable({ providedIn: 'root' })
export class PlansApi {
  private readonly http = inject(HttpClient);

  ruleSets(): Observable<{ items: RuleSetRow[] }> {
    return this.http.get<{ items: RuleSetRow[] }>('/api/rule-sets', { params: { latest: 'true', pageSize: 200 } });
  }

  create(body: CreatePlanBody): Observable<PlanDetail> {
    return this.http.post<PlanDetail>('/api/plans', body);
  }
}
