import { organizationLabel, type OrganizationChoice } from './organization-label';

const lab: OrganizationChoice = { organizationId: 'aaaaaaaa-1111', organizationName: 'Kestrel Bay Radio Test Laboratory', kind: 'lab' };
const maker: OrganizationChoice = { organizationId: 'bbbbbbbb-2222', organizationName: 'Halyard Marine Radio Works', kind: 'manufacturer' };

// Common practice: show names, never ids, and tell apart two entries that would look alike.
describe('organizationLabel', () => {
  it('shows the name', () => {
    expect(organizationLabel(lab, [lab, maker])).toBe('Kestrel Bay Radio Test Laboratory');
    expect(organizationLabel(maker, [lab, maker])).toBe('Halyard Marine Radio Works');
  });

  it('adds the kind when two organizations share a name', () => {
    const twin: OrganizationChoice = { organizationId: 'cccccccc-3333', organizationName: 'Halyard Marine Radio Works', kind: 'lab' };
    expect(organizationLabel(maker, [maker, twin])).toBe('Halyard Marine Radio Works (manufacturer)');
    expect(organizationLabel(twin, [maker, twin])).toBe('Halyard Marine Radio Works (lab)');
  });

  it('falls back to the kind and a short id without a name', () => {
    expect(organizationLabel({ organizationId: 'dddddddd-4444', kind: 'manufacturer' }, [])).toBe('Manufacturer dddddddd');
    expect(organizationLabel({ organizationId: 'eeeeeeee-5555', organizationName: '  ', kind: 'lab' }, [])).toBe('Lab eeeeeeee');
  });
});
