/**
 * One sentence describing a mask's limit line, for the plot's accessible name and for people who
 * do not read plots: each vertex as "limit at ±offset", then the value beyond the last vertex.
 * Numbers in en-GB style with a true minus sign. Never throws; no vertices gives a sentence too.
 * @example maskSummary([[1500, 0], [1500, -28], [4500, -28]], 'mean power')
 * // 'Emission mask relative to mean power: 0 dB at ±1.5 kHz, −28 dB at ±1.5 kHz, −28 dB at ±4.5 kHz; −28 dB beyond ±4.5 kHz.'
 */
export function maskSummary(vertices: readonly (readonly [number, number])[], reference: string): string {
  if (vertices.length === 0) return `Emission mask relative to ${reference}: no valid vertices yet.`;
  const dB = (v: number) => `${v < 0 ? '\u2212' : ''}${Math.abs(v).toLocaleString('en-GB', { maximumFractionDigits: 2 })} dB`;
  const kHz = (hz: number) => `±${(hz / 1e3).toLocaleString('en-GB', { maximumFractionDigits: 3 })} kHz`;
  const last = vertices[vertices.length - 1];
  return `Emission mask relative to ${reference}: ${vertices.map(([x, y]) => `${dB(y)} at ${kHz(x)}`).join(', ')}; ${dB(last[1])} beyond ${kHz(last[0])}.`;
}
