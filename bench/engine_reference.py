#!/usr/bin/env python3
"""Reference implementation of the engine benchmark's workloads in numpy/scipy.

Two modes, both printing one JSON line on stdout:

  python3 bench/engine_reference.py micro --sizes 1,10,100 [--segment 4096]
      Times (best of several runs, in-process) a mask check of 100,001 x size points, the 99 %
      occupied bandwidth of the same trace, and a Welch PSD of 1.92 M x size complex samples.

  python3 bench/engine_reference.py analyze FILE.sigmf-meta [--segment 4096]
      The whole analysis of a SigMF cf32_le/ci16_le capture, run as one process (the bench times
      the process from outside): read, PEP, mean power, Welch PSD (Hann, 50 % overlap,
      two-sided, density scaling as scipy.signal.welch), tones, carrier and unwanted-sideband
      suppression, IMD3/IMD5 below PEP, 99 % occupied bandwidth.

Not a test and not our engine: an independent, idiomatic numpy/scipy version of the same work,
so the ratio ours/theirs says how our TypeScript compares with vectorized C loops.
"""
import json
import sys
import time

import numpy as np
from scipy import signal


def mask_check(freq_hz, level_dbm, center_hz, reference_dbm, vertices):
    offsets = np.array([v[0] for v in vertices], dtype=float)
    rel_db = np.array([v[1] for v in vertices], dtype=float)
    limit = reference_dbm + np.interp(np.abs(freq_hz - center_hz), offsets, rel_db)
    margin = limit - level_dbm
    worst = int(np.argmin(margin))
    return float(margin[worst]), float(freq_hz[worst])


def occupied_bandwidth(freq_hz, power_linear, fraction=0.99):
    cumulative = np.cumsum(power_linear)
    total = cumulative[-1]
    tail = (1 - fraction) / 2 * total
    lower = np.searchsorted(cumulative, tail)
    upper = np.searchsorted(cumulative, total - tail)
    return float(freq_hz[min(upper, len(freq_hz) - 1)] - freq_hz[lower])


def best_of(action, repeats):
    best = float('inf')
    for _ in range(repeats):
        start = time.perf_counter()
        action()
        best = min(best, time.perf_counter() - start)
    return best


def micro(sizes, segment):
    rng = np.random.default_rng(7)
    vertices = [[0, 0], [1500, 0], [1500, -28], [4500, -28], [4500, -35], [7500, -35], [7500, -43]]
    results = []
    for size in sizes:
        points = 100_001 * size
        freq = np.linspace(2_170_000, 2_194_000, points)
        level = -60 + 10 * rng.standard_normal(points)
        repeats = 5 if size <= 10 else 2
        mask_s = best_of(lambda: mask_check(freq, level, 2_182_000, 0.0, vertices), repeats)
        obw_s = best_of(lambda: occupied_bandwidth(freq, 10 ** (level / 10)), repeats)
        entry = {'size': size, 'maskPoints': points, 'maskSeconds': mask_s, 'obwSeconds': obw_s}
        samples = 1_920_000 * size
        if samples <= 19_200_000:
            x = rng.standard_normal(samples) + 1j * rng.standard_normal(samples)
            x = x.astype(np.complex64)
            welch_s = best_of(
                lambda: signal.welch(x, fs=192_000, window='hann', nperseg=segment,
                                     return_onesided=False, scaling='density', detrend=False),
                3 if size == 1 else 1)
            entry.update({'welchSamples': samples, 'welchSeconds': welch_s})
        results.append(entry)
    return {'mode': 'micro', 'numpy': np.__version__, 'segment': segment, 'results': results}


def analyze(meta_path, segment):
    with open(meta_path) as handle:
        meta = json.load(handle)
    glob = meta['global']
    rate = float(glob['core:sample_rate'])
    datatype = glob['core:datatype']
    data_path = meta_path[: -len('.sigmf-meta')] + '.sigmf-data'
    if datatype == 'cf32_le':
        x = np.fromfile(data_path, dtype='<c8')
    elif datatype == 'ci16_le':
        raw = np.fromfile(data_path, dtype='<i2').astype(np.float32) / 32768
        x = raw[0::2] + 1j * raw[1::2]
    else:
        raise SystemExit(f'engine_reference.py: datatype {datatype} not handled')
    envelope = x.real.astype(np.float64) ** 2 + x.imag.astype(np.float64) ** 2
    mean_power = float(np.mean(envelope))
    pep = float(np.max(envelope))
    freq, psd = signal.welch(x, fs=rate, window='hann', nperseg=segment,
                             return_onesided=False, scaling='density', detrend=False)
    freq = np.fft.fftshift(freq)
    psd = np.fft.fftshift(psd)
    df = rate / segment
    power = psd * df

    def band_power(f_hz, half_bins=3):
        k = int(np.argmin(np.abs(freq - f_hz)))
        return float(np.sum(power[max(0, k - half_bins): k + half_bins + 1]))

    # Tones: local maxima 30 dB above the median floor, strongest first.
    floor = np.median(power)
    peaks, _ = signal.find_peaks(power, height=floor * 1e3, distance=8)
    order = peaks[np.argsort(power[peaks])[::-1]]
    tones = [{'frequencyHz': float(freq[k]), 'levelDbfs': 10 * np.log10(band_power(freq[k]))}
             for k in order[:8]]
    pep_db = 10 * np.log10(pep)
    carrier_db = pep_db - 10 * np.log10(band_power(0.0))
    strongest = tones[0]['frequencyHz'] if tones else 0.0
    sideband = 'usb' if strongest >= 0 else 'lsb'
    unwanted_db = None
    imd3 = imd5 = None
    if tones:  # strongest wanted tone vs the power at its mirror frequency
        unwanted_db = tones[0]['levelDbfs'] - 10 * np.log10(band_power(-strongest))
    if len(tones) >= 2:
        f1, f2 = sorted([tones[0]['frequencyHz'], tones[1]['frequencyHz']])
        delta = f2 - f1
        imd3 = pep_db - 10 * np.log10(max(band_power(f1 - delta), band_power(f2 + delta)))
        imd5 = pep_db - 10 * np.log10(max(band_power(f1 - 2 * delta), band_power(f2 + 2 * delta)))
    obw = occupied_bandwidth(freq, power)
    return {
        'mode': 'analyze', 'sampleRateHz': rate, 'sampleCount': int(x.size), 'sideband': sideband,
        'pepDbfs': pep_db, 'meanPowerDbfs': 10 * np.log10(mean_power),
        'carrierSuppressionDb': carrier_db, 'unwantedSidebandSuppressionDb': unwanted_db,
        'imd3Db': imd3, 'imd5Db': imd5, 'occupiedBandwidthHz': obw, 'tones': tones,
    }


def option(args, name, default):
    return args[args.index(name) + 1] if name in args else default


def main(args):
    segment = int(option(args, '--segment', '4096'))
    if args and args[0] == 'micro':
        sizes = [int(s) for s in option(args, '--sizes', '1,10,100').split(',')]
        print(json.dumps(micro(sizes, segment)))
    elif len(args) >= 2 and args[0] == 'analyze':
        print(json.dumps(analyze(args[1], segment)))
    else:
        print(__doc__, file=sys.stderr)
        return 2
    return 0


if __name__ == '__main__':
    sys.exit(main(sys.argv[1:]))
