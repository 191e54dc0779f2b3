/**
 * The invented demo scenario: one lab, one manufacturer, a person for each role, a few radios and
 * plans. Every name here is made up for the demo.
 */
import type { Role } from '../../shared/access/roles';

export const DEMO_PASSWORD = 'sidecheck-demo-2026';

export const DEMO_LAB = {
  name: 'Kestrel Bay Radio Test Laboratory',
  code: 'KBRTL',
  addressLines: ['Unit 4, Saltmarsh Technology Park', 'Harrowgate Road', 'Port Kestrel KB7 2QT'],
  email: 'lab@kestrelbay.example',
  phone: '+44 1632 960 118',
  accreditation: 'Accredited to ISO/IEC 17025:2017, demo accreditation no. 9000 (invented)',
  settings: { testSite: 'Kestrel Bay RF laboratory, screened room 2', attachPdfToEmail: true },
};

export const DEMO_MANUFACTURER = {
  name: 'Halyard Marine Radio Works',
  code: 'HMRW',
  addressLines: ['18 Chandlers Quay', 'Wendlebury Harbour WH3 9LP'],
  email: 'compliance@halyard-radio.example',
};

export const DEMO_PEOPLE: { email: string; displayName: string; org: 'lab' | 'manufacturer'; roles: Role[] }[] = [
  { email: 'imogen.varga@kestrelbay.example', displayName: 'Imogen Varga', org: 'lab', roles: ['lab-admin'] },
  { email: 'tomasz.ellery@kestrelbay.example', displayName: 'Tomasz Ellery', org: 'lab', roles: ['engineer'] },
  { email: 'priya.castellanos@kestrelbay.example', displayName: 'Priya Castellanos', org: 'lab', roles: ['reviewer'] },
  { email: 'owen.achterberg@kestrelbay.example', displayName: 'Owen Achterberg', org: 'lab', roles: ['billing'] },
  { email: 'delphine.okafor@halyard-radio.example', displayName: 'Delphine Okafor', org: 'manufacturer', roles: ['manufacturer-admin'] },
  { email: 'rafael.lindqvist@halyard-radio.example', displayName: 'Rafael Lindqvist', org: 'manufacturer', roles: ['manufacturer-viewer'] },
];

export const DEMO_DEVICES = [
  {
    manufacturer: 'Halyard Marine Radio Works',
    model: 'Halyard HX-150 marine HF radiotelephone',
    serialNumber: 'HX150-00417',
    firmware: '2.4.1',
    ratedPepW: 150,
    emissionDesignator: '2K70J3E',
    frequencyMinHz: 1_605_000,
    frequencyMaxHz: 27_500_000,
    modes: ['USB', 'LSB'],
    receivedOn: '2026-11-16',
  },
  {
    manufacturer: 'Halyard Marine Radio Works',
    model: 'Halyard HX-400 coast station exciter',
    serialNumber: 'HX400-00052',
    firmware: '1.9.0',
    ratedPepW: 400,
    emissionDesignator: '2K70J3E',
    frequencyMinHz: 1_605_000,
    frequencyMaxHz: 27_500_000,
    modes: ['USB'],
    receivedOn: '2026-11-20',
  },
];
