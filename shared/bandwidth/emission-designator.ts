import { formatNecessaryBandwidth, parseNecessaryBandwidthCode } from './necessary-bandwidth-code';

/** An emission designator split into its parts. */
export interface EmissionDesignator {
  necessaryBandwidthHz: number;
  /** The four-character bandwidth code as written, e.g. '2K70'. */
  bandwidthCode: string;
  /** The three basic characteristics, e.g. 'J3E'. */
  emissionClass: string;
  /** Optional fourth and fifth (additional) characteristics, '' when absent. */
  additional: string;
}

// Symbols of RR Appendix 1 §2 (basic) and §3 (additional). The full lists are from memory;
// verify against the edition in force before extending them.
const FIRST = 'NAHRJBCFGDPKLMQVWX';
const SECOND = '0123789X';
const THIRD = 'NABCDEFWX';
const FOURTH = 'ABCDEFGHJKLMNWX';
const FIFTH = 'CFNTWX';

/**
 * Parses an emission designator such as '2K70J3E': a four-character necessary bandwidth, the
 * three basic characteristics (modulation of the main carrier, nature of the modulating signal,
 * type of information) and up to two optional additional characteristics. Case and surrounding
 * spaces are ignored.
 *
 * Source: ITU RR Appendix 1 and 47 CFR 2.201/2.202 (published); symbol lists from memory.
 * Bad input: RangeError (TypeError for non-strings) starting with the function name, naming
 * the character that is wrong.
 *
 * @example parseEmissionDesignator('2K70J3E');
 * // { necessaryBandwidthHz: 2700, bandwidthCode: '2K70', emissionClass: 'J3E', additional: '' }
 */
export function parseEmissionDesignator(designator: string): EmissionDesignator {
  const fn = 'parseEmissionDesignator';
  if (typeof designator !== 'string') throw new TypeError(`${fn}: designator must be a string`);
  const text = designator.trim().toUpperCase();
  if (text.length < 7 || text.length > 9) {
    throw new RangeError(
      `${fn}: '${designator}' must be a 4-character bandwidth and a 3-character class, ` +
        "e.g. '2K70J3E'",
    );
  }
  let necessaryBandwidthHz: number;
  try {
    necessaryBandwidthHz = parseNecessaryBandwidthCode(text.slice(0, 4));
  } catch (error) {
    // Re-badge the bandwidth error so the message names this function.
    const reason = (error as Error).message.replace(/^parseNecessaryBandwidthCode: /, '');
    throw new RangeError(`${fn}: bandwidth part ${reason}`);
  }
  const checks: Array<[string, string, string]> = [
    [text[4], FIRST, 'first symbol (modulation of the main carrier)'],
    [text[5], SECOND, 'second symbol (nature of the modulating signal)'],
    [text[6], THIRD, 'third symbol (type of information)'],
    [text[7], FOURTH, 'fourth symbol (details of signal)'],
    [text[8], FIFTH, 'fifth symbol (nature of multiplexing)'],
  ];
  for (const [symbol, allowed, what] of checks) {
    if (symbol !== undefined && !allowed.includes(symbol)) {
      throw new RangeError(`${fn}: '${symbol}' is not a valid ${what} in '${designator}'`);
    }
  }
  return {
    necessaryBandwidthHz,
    bandwidthCode: text.slice(0, 4),
    emissionClass: text.slice(4, 7),
    additional: text.slice(7),
  };
}

/**
 * Builds a designator from a bandwidth and a class: formatNecessaryBandwidth(hz) + class.
 * The class is validated by parsing the result. Bad input: RangeError from either step.
 *
 * @example formatEmissionDesignator({ necessaryBandwidthHz: 2700, emissionClass: 'J3E' });
 * // '2K70J3E'
 */
export function formatEmissionDesignator(
  parts: { necessaryBandwidthHz: number; emissionClass: string },
): string {
  const designator = formatNecessaryBandwidth(parts.necessaryBandwidthHz) + parts.emissionClass;
  parseEmissionDesignator(designator);
  return designator;
}
