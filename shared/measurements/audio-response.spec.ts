import { ITU_R_M1173_AUDIO_RESPONSE, checkAudioResponse } from './audio-response';

describe('checkAudioResponse (ITU-R M.1173 §3: 350–2700 Hz, 6 dB total variation, published)', () => {
  const band = ITU_R_M1173_AUDIO_RESPONSE;

  it('holds the published passband and variation', () => {
    expect([band.passbandLowHz, band.passbandHighHz, band.permittedVariationDb]).toEqual(
      [350, 2700, 6],
    );
  });

  it('passes a response with 4 dB variation, ignoring points outside the band', () => {
    const r = checkAudioResponse({
      ...band,
      points: [
        { audioHz: 200, levelDb: -20 }, // outside: ignored
        { audioHz: 350, levelDb: -3 },
        { audioHz: 1000, levelDb: 0 },
        { audioHz: 2000, levelDb: -1 },
        { audioHz: 2700, levelDb: -4 },
        { audioHz: 3500, levelDb: -30 }, // outside: ignored
      ],
    });
    expect(r).toEqual({
      verdict: 'pass',
      variationDb: 4,
      marginDb: 2,
      maxLevelDb: 0,
      minLevelDb: -4,
      maxAudioHz: 1000,
      minAudioHz: 2700,
      pointsInBand: 4,
      coversBandEdges: true,
    });
  });

  it('exactly 6 dB passes ("total variation of 6 dB"), 6.5 dB fails', () => {
    const at = (edgeDb: number) =>
      checkAudioResponse({
        ...band,
        points: [
          { audioHz: 350, levelDb: edgeDb },
          { audioHz: 1000, levelDb: 0 },
          { audioHz: 2700, levelDb: -1 },
        ],
      });
    expect(at(-6).verdict).toBe('pass');
    expect(at(-6).marginDb).toBe(0);
    expect(at(-6.5).verdict).toBe('fail');
    expect(at(-6.5).marginDb).toBe(-0.5);
  });

  it('reports when the band edges were not measured', () => {
    const r = checkAudioResponse({
      ...band,
      points: [
        { audioHz: 400, levelDb: 0 },
        { audioHz: 2600, levelDb: -2 },
      ],
    });
    expect(r.coversBandEdges).toBe(false);
    expect(r.variationDb).toBe(2);
  });

  it('throws with fewer than two in-band points or bad input', () => {
    expect(() => checkAudioResponse({ ...band, points: [] })).toThrow(
      /^checkAudioResponse: need at least two points inside 350–2700 Hz/,
    );
    expect(() => checkAudioResponse({ ...band, points: [{ audioHz: 1000, levelDb: 0 }] })).toThrow(
      RangeError,
    );
    expect(() =>
      checkAudioResponse({ ...band, points: [{ audioHz: 1000, levelDb: NaN }] }),
    ).toThrow(/points\[0\]\.levelDb/);
    expect(() =>
      checkAudioResponse({ ...band, passbandLowHz: 3000, points: [] }),
    ).toThrow(/passbandLowHz must be below/);
    expect(() => checkAudioResponse({ ...band, permittedVariationDb: -1, points: [] })).toThrow(
      /permittedVariationDb/,
    );
  });
});
