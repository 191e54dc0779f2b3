/** Printed as the identification of the equipment and its holder (client). */
import { drawKeyValueList } from '../../pdf-kit/key-value-list';
import type { CertificateSection } from '../certificate-section';

export const certificateIdentificationSection: CertificateSection = {
  id: 'identification',
  render(ctx, cert) {
    ctx.subheading('Equipment');
    const d = cert.device;
    drawKeyValueList(ctx, [
      { label: 'Manufacturer', value: d.manufacturer },
      { label: 'Model', value: d.model },
      { label: 'Serial number', value: d.serialNumber },
      { label: 'Firmware', value: d.firmware ?? 'Not stated' },
      { label: 'Emission designator', value: d.emissionDesignator },
      { label: 'Rated PEP', value: `${d.ratedPepW} W` },
      { label: 'Client', value: [cert.client.name, ...cert.client.addressLines].join(', ') },
    ]);
  },
};
