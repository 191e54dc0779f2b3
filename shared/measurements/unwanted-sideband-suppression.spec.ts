import { imageFrequencyHz, unwantedSidebandSuppressionDb } from './unwanted-sideband-suppression';

describe('unwanted-sideband suppression (single-tone method, common practice)', () => {
  it('S = wanted − image', () => {
    expect(unwantedSidebandSuppressionDb({ wantedToneDbm: 50, imageToneDbm: 10 })).toBe(40);
    expect(unwantedSidebandSuppressionDb({ wantedToneDbm: 47, imageToneDbm: -8 })).toBe(55);
    expect(unwantedSidebandSuppressionDb({ wantedToneDbm: 47, imageToneDbm: -Infinity })).toBe(
      Infinity,
    );
  });

  it('USB on 2182 kHz with a 1 kHz tone: RF tone 2183 kHz, image 2181 kHz (mirror about the carrier)', () => {
    expect(imageFrequencyHz({ carrierHz: 2_182_000, toneHz: 2_183_000 })).toBe(2_181_000);
    // LSB: tone below the carrier, image above
    expect(imageFrequencyHz({ carrierHz: 7_100_000, toneHz: 7_098_500 })).toBe(7_101_500);
  });

  it('the image of the image is the tone (involution property)', () => {
    const carrierHz = 16_420_000;
    for (const toneHz of [16_420_300, 16_422_700, 16_419_000]) {
      expect(imageFrequencyHz({ carrierHz, toneHz: imageFrequencyHz({ carrierHz, toneHz }) })).toBe(
        toneHz,
      );
    }
  });

  it('throws with the function name', () => {
    expect(() =>
      unwantedSidebandSuppressionDb({ wantedToneDbm: Infinity, imageToneDbm: 0 }),
    ).toThrow(
      /^unwantedSidebandSuppressionDb: wantedToneDbm/,
    );
    expect(() => unwantedSidebandSuppressionDb({ wantedToneDbm: 0, imageToneDbm: NaN })).toThrow(
      RangeError,
    );
    expect(() => imageFrequencyHz({ carrierHz: NaN, toneHz: 1 })).toThrow(/^imageFrequencyHz: /);
  });
});
