import { HttpClient, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { PrecheckFields } from '../../../shared/schemas/uploads';
import type { PhasingDiagnosis } from '../../../shared/phasing/diagnose-phasing';
import { uploadForm, type MaskFigures, type UploadAnalysis, type UploadParts } from '../runs/uploads-api';

/** A built-in sample rule set a pre-check can be run against. */
export interface SampleRuleSet {
  id: string;
  key: string;
  name: string;
  version: number;
  description?: string;
}

export type PrecheckCheck =
  | { kind: string; label: string; value: number; unit: string; limit: number; limitText: string; margin: number; expandedUncertainty: number; verdict: string; decisionRuleText: string; inputs: Record<string, unknown>; mask?: MaskFigures }
  | { kind: string; label: string; problem: string };

/** The answer of POST /api/precheck (server/uploads/run-precheck.ts): nothing of it is stored. */
export interface PrecheckAnswer {
  unaccredited: true;
  notice: string;
  ruleSet: { id: string; key: string; name: string; version: number; sampleNotice: string | null };
  format: string;
  file: { name: string; sizeBytes: number; sha256: string };
  data: { name: string; sizeBytes: number; sha256: string } | null;
  parameters: Record<string, unknown>;
  analysis: UploadAnalysis;
  checks: PrecheckCheck[];
  phasing: PhasingDiagnosis | null;
}

/** Typed access to the manufacturer's self-service pre-check. */
@Injectable({ providedIn: 'root' })
export class PrecheckApi {
  private readonly http = inject(HttpClient);

  /** The built-in sample rule sets a manufacturer may check against. */
  sampleRuleSets(): Observable<{ items: SampleRuleSet[] }> {
    return this.http.get<{ items: SampleRuleSet[] }>('/api/precheck/rule-sets');
  }

  /** Multipart POST with progress events; unsubscribing aborts it. */
  run(parts: UploadParts, fields: PrecheckFields): Observable<HttpEvent<PrecheckAnswer>> {
    return this.http.post<PrecheckAnswer>('/api/precheck', uploadForm(parts, fields), { reportProgress: true, observe: 'events' });
  }
}
