import fs from 'node:fs/promises';
import { ENGINE_VERSION } from '../../shared/engine-version';
import { encodeIqChunk, type WritableDatatype } from './encode-iq-chunk';

/** What goes into the `.sigmf-meta` besides the datatype. */
export interface SigmfPairDescription {
  sampleRateHz: number;
  datatype: WritableDatatype;
  description: string;
  centerFrequencyHz?: number;
}

/**
 * Writes PREFIX.sigmf-meta and PREFIX.sigmf-data (SigMF specification v1.x: core:version,
 * core:datatype, core:sample_rate, one capture at sample 0, no annotations) from a chunk source,
 * writing the data chunk by chunk so memory stays bounded.
 *
 * @returns the paths written and the number of samples.
 */
export async function writeSigmfPair(
  prefix: string,
  description: SigmfPairDescription,
  nextChunk: () => { i: Float32Array; q: Float32Array } | null,
): Promise<{ metaPath: string; dataPath: string; sampleCount: number }> {
  const metaPath = `${prefix}.sigmf-meta`;
  const dataPath = `${prefix}.sigmf-data`;
  const handle = await fs.open(dataPath, 'w');
  let sampleCount = 0;
  try {
    for (let chunk = nextChunk(); chunk !== null; chunk = nextChunk()) {
      sampleCount += chunk.i.length;
      await handle.write(encodeIqChunk(chunk.i, chunk.q, description.datatype));
    }
  } finally {
    await handle.close();
  }
  const capture: Record<string, number> = { 'core:sample_start': 0 };
  if (description.centerFrequencyHz !== undefined) {
    capture['core:frequency'] = description.centerFrequencyHz;
  }
  const meta = {
    global: {
      'core:version': '1.0.0',
      'core:datatype': description.datatype,
      'core:sample_rate': description.sampleRateHz,
      'core:description': description.description,
      'core:recorder': `sidecheck synthesize ${ENGINE_VERSION}`,
    },
    captures: [capture],
    annotations: [],
  };
  await fs.writeFile(metaPath, JSON.stringify(meta, null, 2) + '\n');
  return { metaPath, dataPath, sampleCount };
}
