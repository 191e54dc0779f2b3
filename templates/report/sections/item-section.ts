/**
 * Printed as "Item tested": description, identification and condition of the radio (ISO/IEC
 * 17025:2017 7.8.2.1 g), then the dates of receipt, testing and issue, the place of testing and
 * the sampling statement (7.8.2.1 c, h, i, j, k).
 */
import { drawKeyValueList } from '../../pdf-kit/key-value-list';
import type { ReportSection } from '../report-section';

export const itemSection: ReportSection = {
  id: 'item',
  render(ctx, report) {
    ctx.heading('Item tested');
    const d = report.device;
    drawKeyValueList(ctx, [
      { label: 'Description', value: `HF SSB transmitter, ${d.emissionDesignator}` },
      { label: 'Manufacturer', value: d.manufacturer },
      { label: 'Model', value: d.model },
      { label: 'Serial number', value: d.serialNumber },
      { label: 'Firmware', value: d.firmware ?? 'Not stated' },
      { label: 'Rated PEP', value: `${d.ratedPepW} W` },
      { label: 'Emission designator', value: d.emissionDesignator },
      { label: 'Frequency range', value: d.frequencyRange },
      { label: 'Modes', value: d.modes.join(', ') },
      { label: 'Condition on receipt', value: d.condition },
    ]);
    ctx.subheading('Dates and place of testing');
    const dates = report.dates;
    drawKeyValueList(ctx, [
      { label: 'Date of receipt', value: dates.received },
      {
        label: 'Dates of testing',
        value:
          dates.testedFrom === dates.testedTo
            ? dates.testedFrom
            : `${dates.testedFrom} to ${dates.testedTo}`,
      },
      { label: 'Date of issue', value: dates.issued },
      { label: 'Place of testing', value: report.testSite },
      {
        label: 'Sampling',
        value: report.sampling ?? 'Not applicable: the item was submitted by the client.',
      },
    ]);
  },
};
