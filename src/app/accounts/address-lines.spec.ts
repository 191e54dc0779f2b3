import { addressLines } from './address-lines';

// Common practice: one address item per line, as printed on a report's first page (ISO/IEC 17025:2017 7.8.2.1 b asks for the lab's address).
describe('addressLines', () => {
  it.each([
    ['', []],
    ['   \n  ', []],
    [' 4 Quay Road \n\nPortsmouth PO1 3AB\n', ['4 Quay Road', 'Portsmouth PO1 3AB']],
    ['Unit 7\r\nHarbour Park\r\nUnited Kingdom', ['Unit 7', 'Harbour Park', 'United Kingdom']],
  ])('%j → %j', (text, expected) => {
    expect(addressLines(text)).toEqual(expected);
  });
});
