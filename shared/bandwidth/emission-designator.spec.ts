import { formatEmissionDesignator, parseEmissionDesignator } from './emission-designator';
import { h3eNecessaryBandwidthHz, j3eNecessaryBandwidthHz } from './necessary-bandwidth';

describe('emission designators (RR Appendix 1, 47 CFR 2.201/2.202)', () => {
  it("parses '2K70J3E' (published example)", () => {
    expect(parseEmissionDesignator('2K70J3E')).toEqual({
      necessaryBandwidthHz: 2700,
      bandwidthCode: '2K70',
      emissionClass: 'J3E',
      additional: '',
    });
  });

  it('parses other classes, optional additional symbols, lower case and spaces', () => {
    expect(parseEmissionDesignator('3K00H3E').necessaryBandwidthHz).toBe(3000);
    expect(parseEmissionDesignator(' 2k80j2b ').emissionClass).toBe('J2B');
    expect(parseEmissionDesignator('16K0F3EJN').additional).toBe('JN');
    expect(parseEmissionDesignator('100HA1A').necessaryBandwidthHz).toBe(100);
  });

  it('J3E: Bn = highest − lowest audio frequency, 3000 − 300 → 2K70J3E; H3E: Bn = M → 3K00H3E (published)', () => {
    expect(
      formatEmissionDesignator({
        necessaryBandwidthHz: j3eNecessaryBandwidthHz(300, 3000),
        emissionClass: 'J3E',
      }),
    ).toBe('2K70J3E');
    expect(
      formatEmissionDesignator({
        necessaryBandwidthHz: h3eNecessaryBandwidthHz(3000),
        emissionClass: 'H3E',
      }),
    ).toBe('3K00H3E');
    // ITU-R M.1173 passband 350–2700 Hz → 2350 Hz → 2K35J3E (arithmetic)
    expect(
      formatEmissionDesignator({
        necessaryBandwidthHz: j3eNecessaryBandwidthHz(350, 2700),
        emissionClass: 'J3E',
      }),
    ).toBe('2K35J3E');
  });

  it.each([
    ['2K7J3E', /must be a 4-character bandwidth and a 3-character class/],
    ['', /must be a 4-character bandwidth/],
    ['0K27J3E', /bandwidth part '0K27' may not start with 0/],
    ['2K70Z3E', /'Z' is not a valid first symbol \(modulation of the main carrier\)/],
    ['2K70J4E', /'4' is not a valid second symbol/],
    ['2K70J3Z', /'Z' is not a valid third symbol/],
    ['2K70J3EI', /'I' is not a valid fourth symbol/],
    ['2K70J3ENA', /'A' is not a valid fifth symbol/],
  ])('rejects %p with a clear message', (designator, message) => {
    expect(() => parseEmissionDesignator(designator)).toThrow(message);
    expect(() => parseEmissionDesignator(designator)).toThrow(/^parseEmissionDesignator: /);
  });

  it('rejects non-strings and a bad class when formatting', () => {
    expect(() => parseEmissionDesignator(42 as unknown as string)).toThrow(TypeError);
    expect(
      () => formatEmissionDesignator({ necessaryBandwidthHz: 2700, emissionClass: 'Q9Q' }),
    ).toThrow(RangeError);
  });

  it('necessary-bandwidth helpers reject bad audio bands', () => {
    expect(() => j3eNecessaryBandwidthHz(3000, 300)).toThrow(
      /^j3eNecessaryBandwidthHz: need 0 ≤ lowAudioHz < highAudioHz/,
    );
    expect(() => j3eNecessaryBandwidthHz(-1, 300)).toThrow(RangeError);
    expect(() => j3eNecessaryBandwidthHz(NaN, 300)).toThrow(RangeError);
    expect(() => h3eNecessaryBandwidthHz(0)).toThrow(/^h3eNecessaryBandwidthHz: /);
  });
});
