/** Sent when instruments of a lab fall due for calibration within 30 days or are overdue: to the lab's administrators. */
import { renderEmail, type RenderedEmail } from './layout';

export interface CalibrationDueInstrument {
  name: string;
  model: string;
  serialNumber: string;
  /** Calibration due date, ISO YYYY-MM-DD (UTC), shown as written. */
  calibrationDue: string;
  overdue: boolean;
}

export function calibrationDueEmail(input: {
  adminName: string;
  labName: string;
  instruments: CalibrationDueInstrument[];
  /** The equipment register, e.g. https://sidecheck.example/equipment. */
  equipmentUrl: string;
}): RenderedEmail {
  const overdue = input.instruments.filter((i) => i.overdue).length;
  const n = input.instruments.length;
  const what = n === 1 ? `${input.instruments[0].name} (s/n ${input.instruments[0].serialNumber})` : `${n} instruments`;
  return renderEmail({
    subject: overdue > 0 ? `Calibration overdue at ${input.labName}: ${what}` : `Calibration due soon at ${input.labName}: ${what}`,
    paragraphs: [
      `Dear ${input.adminName},`,
      n === 1
        ? `One instrument of ${input.labName} falls due for calibration within 30 days or is overdue:`
        : `${n} instruments of ${input.labName} fall due for calibration within 30 days or are overdue:`,
      ...input.instruments.map((i) => `${i.name}, ${i.model}, s/n ${i.serialNumber}: ${i.overdue ? 'overdue, was due' : 'due'} ${i.calibrationDue}`),
      'An overdue instrument cannot be put on a run, and readings with it are refused, until it is recalibrated and its new dates are entered in the register.',
    ],
    action: { label: 'Open the equipment register', url: input.equipmentUrl },
    footnote: 'You receive this once per instrument and due date.',
  });
}
