import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { RuleSetBody } from '../../../shared/rules/rule-set';
import type { EditRuleSetBody } from '../../../shared/schemas/rule-set';
import type { Page } from '../runs/runs-api';
import { listParams } from '../settings/list-params';

/** A rule set version as the API shows it (server/rule-sets/rule-set-versions.ts presentRuleSet). */
export interface RuleSet {
  id: string;
  key: string;
  version: number;
  name: string;
  service: RuleSetBody['service'];
  /** A shipped sample: its limits must be verified against the current edition before use. */
  isSample: boolean;
  /** Belongs to no lab (read-only; copy it to edit). */
  builtIn: boolean;
  body: RuleSetBody;
  createdAt: string;
}

/** Rule sets: the built-in samples and the lab's own, versioned (/api/rule-sets). */
@Injectable({ providedIn: 'root' })
export class RuleSetsApi {
  private readonly http = inject(HttpClient);

  /** The latest version of each rule set (or every version of one key with `key`). */
  list(query: { search?: string; key?: string; latest?: boolean } = {}): Observable<Page<RuleSet>> {
    const { latest = true, ...rest } = query;
    return this.http.get<Page<RuleSet>>('/api/rule-sets', { params: listParams({ pageSize: 200, sort: 'name', ...rest, latest: latest ? 'true' : undefined }) });
  }

  get(id: string): Observable<RuleSet> {
    return this.http.get<RuleSet>(`/api/rule-sets/${encodeURIComponent(id)}`);
  }

  /** The lab's own copy, version 1. */
  copy(id: string, name: string): Observable<RuleSet> {
    return this.http.post<RuleSet>(`/api/rule-sets/${encodeURIComponent(id)}/copy`, { name });
  }

  /** Stores a new version (same key, version + 1); the edited version never changes. */
  saveVersion(id: string, body: EditRuleSetBody): Observable<RuleSet> {
    return this.http.put<RuleSet>(`/api/rule-sets/${encodeURIComponent(id)}`, body);
  }
}
