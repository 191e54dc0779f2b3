/**
 * The demo lab's equipment register: invented instruments (names, models and serial numbers are
 * made up), with calibration dates set relative to the day the demo is seeded so the register
 * always shows one instrument due soon and one overdue. The contributions are example figures of
 * the kind a calibration certificate states (normal, with k = 2) or a specification gives
 * (rectangular half-width).
 */
import type { InstrumentBody } from '../../shared/schemas/instruments';
import { addDaysIso } from '../instruments/calibration-status';

/** Which instruments the demo run on the bench uses (by serial number). */
export const DEMO_RUN_INSTRUMENT_SERIALS = ['KSA-26-0193', 'KAT-40-1127'];

export function demoInstruments(today: string): InstrumentBody[] {
  const calibrated = (dueInDays: number) => ({ calibratedOn: addDaysIso(today, dueInDays - 365), calibrationDue: addDaysIso(today, dueInDays) });
  return [
    {
      name: 'Spectrum analyser 1',
      model: 'Kittiwake KSA-26 spectrum analyser',
      serialNumber: 'KSA-26-0193',
      ...calibrated(240),
      certificateRef: 'Invented calibration lab, certificate C-26-04417',
      contributions: [
        { name: 'Scale fidelity, certificate', distribution: 'normal', value: 0.3, coverageFactor: 2, budget: 'relative' },
        { name: 'Absolute amplitude, certificate', distribution: 'normal', value: 0.5, coverageFactor: 2, budget: 'absolute' },
      ],
    },
    {
      name: '40 dB power attenuator',
      model: 'Kittiwake KAT-40 500 W attenuator',
      serialNumber: 'KAT-40-1127',
      ...calibrated(150),
      certificateRef: 'Invented calibration lab, certificate C-26-03982',
      contributions: [{ name: 'Attenuation, certificate', distribution: 'normal', value: 0.15, coverageFactor: 2, budget: 'absolute' }],
    },
    {
      name: 'Frequency counter',
      model: 'Petrel PFC-3 frequency counter',
      serialNumber: 'PFC-3-5530',
      ...calibrated(12),
      certificateRef: 'Invented calibration lab, certificate C-25-11876',
      contributions: [{ name: 'Timebase, certificate', distribution: 'normal', value: 0.4, coverageFactor: 2, budget: 'frequencyHz' }],
    },
    {
      name: 'Two-tone audio generator',
      model: 'Petrel PAG-2 audio generator',
      serialNumber: 'PAG-2-0871',
      ...calibrated(300),
      certificateRef: 'In-house check, record IH-2026-031',
      contributions: [{ name: 'Tone balance, specification', distribution: 'rectangular', value: 0.1, budget: 'relative' }],
    },
    {
      name: 'RF power meter',
      model: 'Kittiwake KPM-1 power meter',
      serialNumber: 'KPM-1-2046',
      ...calibrated(-9),
      certificateRef: 'Invented calibration lab, certificate C-25-09310',
      contributions: [{ name: 'Power reading, certificate', distribution: 'normal', value: 0.25, coverageFactor: 2, budget: 'absolute' }],
    },
  ];
}
