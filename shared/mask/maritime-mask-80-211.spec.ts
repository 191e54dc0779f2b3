import {
  AVIATION_SSB_AIRCRAFT_MASK_87_139C,
  aviationAssignedFrequencyHz,
} from './aviation-mask-87-139';
import { checkEmissionMask } from './check-emission-mask';
import { maritimeMask80211 } from './maritime-mask-80-211';
import { maskLimitAtOffset } from './mask-limit-at-offset';

describe('maritimeMask80211 (47 CFR 80.211(a), published)', () => {
  const mask = maritimeMask80211({ authorizedBandwidthHz: 3000, meanPowerW: 100 });

  it('is relative to mean power with regions at 50/150/250 % of B (1.5/4.5/7.5 kHz for 3 kHz)', () => {
    expect(mask.reference).toBe('mean');
    expect(mask.exemptWithinOffsetHz).toBe(1500);
    expect(maskLimitAtOffset(mask, 1500.01)).toBe(-28);
    expect(maskLimitAtOffset(mask, 4500.01)).toBe(-35);
    // 43 + 10·log10(100) = 63 dB beyond 250 % (published formula)
    expect(maskLimitAtOffset(mask, 7500.01)).toBeCloseTo(-63, 12);
  });

  it('"up to and including": exactly 150 % is in the 28 dB region, exactly 250 % in the 35 dB region', () => {
    expect(maskLimitAtOffset(mask, 4500)).toBe(-28);
    expect(maskLimitAtOffset(mask, -4500)).toBe(-28);
    expect(maskLimitAtOffset(mask, 7500)).toBe(-35);
  });

  it('an emission exactly at 150 % and 30 dB below mean power passes; at 150.01 % it fails', () => {
    const at = (offsetHz: number) =>
      checkEmissionMask(
        { frequencyHz: [1e6 + offsetHz], levelDbm: [50 - 30] },
        mask,
        { centerHz: 1e6, referenceDbm: 50 },
      ).verdict;
    expect(at(4500)).toBe('pass');
    expect(at(4500.3)).toBe('fail');
  });

  it('uses 25 dB for equipment installed before 1 February 1992', () => {
    const old = maritimeMask80211({
      authorizedBandwidthHz: 3000,
      meanPowerW: 100,
      installedBefore1992: true,
    });
    expect(maskLimitAtOffset(old, 3000)).toBe(-25);
    expect(old.provenance?.notes.join(' ')).toMatch(/25 dB/);
  });

  it.each([
    [1, -43],
    [1000, -73],
  ])('beyond 250 %% tracks 43 + 10·log10(P): %p W → %p dB', (meanPowerW, relDb) => {
    const m = maritimeMask80211({ authorizedBandwidthHz: 3000, meanPowerW });
    expect(maskLimitAtOffset(m, 20_000)).toBeCloseTo(relDb, 12);
  });

  it('scales with the authorized bandwidth', () => {
    const wide = maritimeMask80211({ authorizedBandwidthHz: 4000, meanPowerW: 100 });
    expect(maskLimitAtOffset(wide, 6000)).toBe(-28);
    expect(maskLimitAtOffset(wide, 6000.1)).toBe(-35);
  });

  it('records provenance and an edition', () => {
    expect(mask.provenance?.source).toBe('47 CFR 80.211(a)');
    expect(mask.provenance?.status).toBe('published');
    expect(
      maritimeMask80211({ authorizedBandwidthHz: 3000, meanPowerW: 1, edition: '2024' })
        .provenance?.edition,
    ).toBe('2024');
  });

  it('throws with the function name', () => {
    expect(() => maritimeMask80211({ authorizedBandwidthHz: 0, meanPowerW: 1 })).toThrow(
      /^maritimeMask80211: /,
    );
    expect(() => maritimeMask80211({ authorizedBandwidthHz: 3000, meanPowerW: 0 })).toThrow(
      /meanPowerW/,
    );
    expect(() => maritimeMask80211({ authorizedBandwidthHz: 3000, meanPowerW: NaN })).toThrow(
      RangeError,
    );
  });
});

describe('aviation aircraft SSB mask, 47 CFR 87.139(c) (from memory)', () => {
  const mask = AVIATION_SSB_AIRCRAFT_MASK_87_139C;

  it('is tagged from memory and referred to PEP', () => {
    expect(mask.provenance?.status).toBe('from-memory');
    expect(mask.provenance?.edition).toMatch(/from memory, verify against current edition/);
    expect(mask.reference).toBe('pep');
    expect(Object.isFrozen(mask.vertices)).toBe(true);
  });

  it.each([
    // from memory: 1.5–4.5 kHz ≥ 30 dB, 4.5–7.5 kHz ≥ 38 dB, beyond ≥ 43 dB (aircraft)
    [1500, 0],
    [2000, -30],
    [4500, -30],
    [4600, -38],
    [7500, -38],
    [8000, -43],
  ])('%p Hz from the assigned frequency → %p dB', (offsetHz, relDb) => {
    expect(maskLimitAtOffset(mask, offsetHz)).toBe(relDb);
  });

  it('assigned frequency = carrier + 1400 Hz (from memory)', () => {
    expect(aviationAssignedFrequencyHz(8_891_000)).toBe(8_892_400);
    expect(() => aviationAssignedFrequencyHz(NaN)).toThrow(/^aviationAssignedFrequencyHz: /);
  });
});
