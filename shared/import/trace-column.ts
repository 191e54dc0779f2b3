import { FREQUENCY_UNIT_HZ, isLevelUnit, normalizeUnit, type LevelUnit } from './trace-units';

/** What a trace CSV header cell describes. */
export type TraceColumn =
  | { role: 'frequency'; unit: string; hzPerUnit: number }
  | { role: 'rbw'; unit: string; hzPerUnit: number }
  | { role: 'level'; unit: LevelUnit }
  | { role: 'unitless'; quantity: 'frequency' | 'level' | 'rbw' }
  | { role: 'other' };

/**
 * Reads a trace CSV header cell into its role and unit. The unit may be written in brackets
 * (`Frequency (MHz)`, `Level [dBuV]`) or as the last word (`frequency_hz`, `level dBm`, or the
 * unit alone: `kHz`). Resolution-bandwidth columns (`rbw_hz`, `RBW (kHz)`) are told apart from
 * frequency columns by name. A column named like a frequency or level without a known unit comes
 * back as `unitless` so the caller can refuse it rather than guess; anything else is `other`.
 *
 * @example classifyTraceColumn('Frequency (MHz)')
 * // { role: 'frequency', unit: 'mhz', hzPerUnit: 1e6 }
 * @example classifyTraceColumn('level_dbm')       // { role: 'level', unit: 'dbm' }
 * @example classifyTraceColumn('index')           // { role: 'other' }
 */
export function classifyTraceColumn(cell: string): TraceColumn {
  const text = cell.trim().replace(/^"(.*)"$/, '$1').trim().toLowerCase();
  let name = text;
  let unit = '';
  const bracketed = /^(.*?)\s*[([]\s*([^)\]]*?)\s*[)\]]\s*$/.exec(text);
  if (bracketed !== null) {
    name = bracketed[1];
    unit = normalizeUnit(bracketed[2]);
  } else {
    const words = text.split(/[\s_\-/]+/).filter((word) => word !== '');
    const last = normalizeUnit(words[words.length - 1] ?? '');
    if (FREQUENCY_UNIT_HZ[last] !== undefined || isLevelUnit(last)) {
      unit = last;
      name = words.slice(0, -1).join(' ');
    }
  }
  const isRbw = /(?:^|[^a-z])rbw(?![a-z])|resolution/.test(name);
  const hzPerUnit = FREQUENCY_UNIT_HZ[unit];
  if (hzPerUnit !== undefined) return { role: isRbw ? 'rbw' : 'frequency', unit, hzPerUnit };
  if (isLevelUnit(unit) && !isRbw) return { role: 'level', unit };
  if (isRbw) return { role: 'unitless', quantity: 'rbw' };
  if (/freq/.test(name)) return { role: 'unitless', quantity: 'frequency' };
  if (/level|power|ampl|magnitude|trace/.test(name)) return { role: 'unitless', quantity: 'level' };
  return { role: 'other' };
}
