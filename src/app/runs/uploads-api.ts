import { HttpClient, HttpParams, type HttpEvent } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { UploadFields, UploadFormat } from '../../../shared/schemas/uploads';
import type { PhasingDiagnosis } from '../../../shared/phasing/diagnose-phasing';
import type { Page, StoredResult } from './runs-api';
import type { MaskLine } from './mask-limit-line';

/** A thinned trace or PSD as stored with an upload (server/analysis/plot-points.ts). */
export interface PlotSeries {
  x: (number | null)[];
  y: (number | null)[];
}

/** What the server keeps of an analysed file: a trace's extent, or a capture's figures; both with the plot. */
export type UploadAnalysis =
  | { source: 'trace'; pointCount: number; startHz: number; stopHz: number; rbwHz: number | null; carrierHz: number; sideband: 'usb' | 'lsb'; peak: { frequencyHz: number; levelDbm: number }; plot: PlotSeries }
  | {
      source: 'iq';
      format: string;
      datatype: string;
      sampleRateHz: number;
      sampleCount: number;
      centerHz: number | null;
      figures: { sideband: 'usb' | 'lsb'; pepDbfs: number; meanPowerDbfs: number; pepDbm: number | null; meanPowerDbm: number | null; carrierSuppressionDb: number | null; unwantedSidebandSuppressionDb: number | null; imd3Db: number | null; imd5Db: number | null; occupiedBandwidthHz: number; tones: { frequencyHz: number; levelDbfs: number }[] };
      plot: PlotSeries;
    };

/** The mask check kept with an emission-mask result (shared/evaluation MaskFigures). */
export interface MaskFigures extends MaskLine {
  reference: 'pep' | 'mean';
  worstFrequencyHz: number;
  worstOffsetHz: number;
  worstMarginDb: number;
  pointCount: number;
}

export interface StoredFile {
  name: string;
  sizeBytes: number;
  sha256: string;
  href: string;
}

export interface UploadSummary {
  id: string;
  runId: string;
  testCaseId: string;
  format: UploadFormat;
  file: StoredFile;
  data: StoredFile | null;
  parameters: Record<string, unknown>;
  engineVersion: string;
  uploadedBy: string | null;
  viaApiKey: boolean;
  createdAt: string;
}

export type UploadResult = Omit<StoredResult, 'readingId' | 'detail'> & {
  uploadId: string;
  detail: StoredResult['detail'] & { source?: 'trace' | 'iq'; mask?: MaskFigures; phasing?: PhasingDiagnosis };
};

/** GET /api/uploads/:id and the answer to an upload: the record, its analysis and its result. */
export interface UploadDetail extends UploadSummary {
  analysis: UploadAnalysis;
  result: UploadResult | null;
}

export interface UploadListRow extends UploadSummary {
  result: { id: string; verdict: string; value: number | null; unit: string; limit: number | null; margin: number | null } | null;
}

/** The files of one upload: `file` alone, or a SigMF recording's metadata as `file` and samples as `data`. */
export interface UploadParts {
  file: File;
  data?: File;
}

/** Typed access to the uploads of a run (server/uploads/routes.ts). */
@Injectable({ providedIn: 'root' })
export class UploadsApi {
  private readonly http = inject(HttpClient);

  /**
   * POST multipart/form-data with progress events. Unsubscribing aborts the request (the
   * browser cancels the transfer and the server keeps nothing of it).
   */
  upload(runId: string, caseId: string, parts: UploadParts, fields: UploadFields): Observable<HttpEvent<UploadDetail>> {
    return this.http.post<UploadDetail>(`/api/runs/${encodeURIComponent(runId)}/cases/${encodeURIComponent(caseId)}/uploads`, uploadForm(parts, fields), { reportProgress: true, observe: 'events' });
  }

  list(runId: string, testCaseId?: string): Observable<Page<UploadListRow>> {
    let params = new HttpParams().set('pageSize', 50).set('sort', '-createdAt');
    if (testCaseId) params = params.set('testCaseId', testCaseId);
    return this.http.get<Page<UploadListRow>>(`/api/runs/${encodeURIComponent(runId)}/uploads`, { params });
  }

  get(uploadId: string): Observable<UploadDetail> {
    return this.http.get<UploadDetail>(`/api/uploads/${encodeURIComponent(uploadId)}`);
  }

  /** The raw file exactly as received (the href the server gave: `file` or `?part=data`). */
  raw(file: StoredFile): Observable<Blob> {
    return this.http.get(file.href, { responseType: 'blob' });
  }
}

/** The multipart body: fields first (the server reads them before the file streams in), then the parts. */
export function uploadForm(parts: UploadParts, fields: UploadFields | Record<string, string | number | undefined>): FormData {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) if (value !== undefined && value !== '') form.append(name, String(value));
  form.append('file', parts.file, parts.file.name);
  if (parts.data) form.append('data', parts.data, parts.data.name);
  return form;
}
