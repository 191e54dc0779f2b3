import { detectFileKind, type FileKind } from '../../../shared/import/detect-file-kind';
import type { UploadFormat } from '../../../shared/schemas/uploads';

/** A chosen file as far as planning needs it: its name and its first bytes (512 are enough). */
export interface ChosenFile {
  name: string;
  firstBytes: Uint8Array;
}

export type UploadPlan =
  | {
      ok: true;
      format: UploadFormat;
      /** Indexes into the chosen files in sending order: for SigMF the metadata, then the samples. */
      order: number[];
      /** Headerless samples state no rate: the sender must give sampleRateHz. */
      needsSampleRate: boolean;
      /** Trace or capture, for the words on screen. */
      evidence: 'trace' | 'iq';
      description: string;
    }
  | { ok: false; message: string };

const SINGLE: Partial<Record<FileKind, { format: UploadFormat; evidence: 'trace' | 'iq'; needsSampleRate: boolean; description: string }>> = {
  'trace-csv': { format: 'trace-csv', evidence: 'trace', needsSampleRate: false, description: 'Spectrum-analyzer trace (CSV)' },
  wav: { format: 'wav', evidence: 'iq', needsSampleRate: false, description: 'I/Q capture in a WAV file (stereo: I left, Q right)' },
  'raw-cf32': { format: 'cf32', evidence: 'iq', needsSampleRate: true, description: 'Raw I/Q, 32-bit float pairs' },
  'raw-ci16': { format: 'ci16', evidence: 'iq', needsSampleRate: true, description: 'Raw I/Q, 16-bit integer pairs' },
};

/**
 * What to send for the files someone chose or dropped: one trace CSV, one WAV or raw capture, or a
 * SigMF recording as its two files (.sigmf-meta and .sigmf-data, in either order). Kinds are told
 * by content first and name second (shared/import detectFileKind). `accepts` limits the evidence
 * the test case can be judged from. Pure; never throws: a plan that cannot be sent says why.
 * @example uploadPlan([{ name: 'mask.csv', firstBytes: utf8('frequency_hz,level_dbm\n') }], ['trace'])
 * // { ok: true, format: 'trace-csv', order: [0], needsSampleRate: false, evidence: 'trace', … }
 */
export function uploadPlan(files: readonly ChosenFile[], accepts: readonly ('trace' | 'iq')[]): UploadPlan {
  if (files.length === 0) return { ok: false, message: 'Choose a file first.' };
  const kinds = files.map((f) => detectFileKind(f.name, f.firstBytes));
  let plan: UploadPlan;
  if (files.length === 2) {
    const meta = kinds.findIndex((k) => k.kind === 'sigmf-meta');
    const data = kinds.findIndex((k) => k.kind === 'sigmf-data');
    plan =
      meta >= 0 && data >= 0
        ? { ok: true, format: 'sigmf', order: [meta, data], needsSampleRate: false, evidence: 'iq', description: 'SigMF recording (metadata and samples)' }
        : { ok: false, message: 'Two files can only be a SigMF recording: its .sigmf-meta and its .sigmf-data file.' };
  } else if (files.length > 2) {
    plan = { ok: false, message: 'Choose one file, or the two files of a SigMF recording.' };
  } else {
    const k = kinds[0];
    const single = SINGLE[k.kind];
    if (single) plan = { ok: true, order: [0], ...single };
    else if (k.kind === 'sigmf-meta') plan = { ok: false, message: 'This is SigMF metadata: choose its .sigmf-data file with it.' };
    else if (k.kind === 'sigmf-data') plan = { ok: false, message: 'These are SigMF samples: choose their .sigmf-meta file with them.' };
    else if (k.kind === 'sigmf-archive') plan = { ok: false, message: 'A .sigmf archive must be unpacked first: choose the .sigmf-meta and .sigmf-data files inside it.' };
    else plan = { ok: false, message: `${files[0].name} is not a file Sidecheck reads (${k.reason}). Use a trace CSV, a SigMF pair, a WAV capture or raw .cf32/.ci16 samples.` };
  }
  if (plan.ok && !accepts.includes(plan.evidence)) {
    const wanted = accepts.includes('trace') ? 'a spectrum-analyzer trace (CSV)' : 'an I/Q capture (SigMF, WAV or raw)';
    return { ok: false, message: `This test case is judged from ${wanted}; ${plan.description.toLowerCase()} cannot decide it.` };
  }
  return plan;
}
