import { readUploadFields } from './upload-fields';
import { precheckFieldsSchema, uploadFieldsSchema } from '../../shared/schemas/uploads';
import { Problem } from '../http/problem';

const pointers = (fn: () => unknown): string[] => {
  try {
    fn();
  } catch (error) {
    if (error instanceof Problem) return (error.errors ?? []).map((e) => e.pointer);
    throw error;
  }
  return [];
};

describe('readUploadFields', () => {
  it('turns decimal text into numbers and lower-cases the sideband', () => {
    expect(readUploadFields({ referenceDbm: ' 47.5 ', fullScaleDbm: '-3e1', sideband: 'USB', format: 'wav' }, uploadFieldsSchema)).toEqual({ referenceDbm: 47.5, fullScaleDbm: -30, sideband: 'usb', format: 'wav' });
  });

  it.each([
    [{ referenceDbm: '0x20' }, '/referenceDbm'], // hexadecimal is not a decimal number: left as text, refused
    [{ referenceDbm: '' }, '/referenceDbm'],
    [{ referenceDbm: 'Infinity' }, '/referenceDbm'],
    [{ sampleRateHz: '0' }, '/sampleRateHz'],
    [{ centerHz: '1e12' }, '/centerHz'],
    [{ format: 'mp3' }, '/format'],
    [{ extra: 'x' }, '/extra'],
  ])('refuses %j at %s', (raw, pointer) => {
    expect(pointers(() => readUploadFields(raw, uploadFieldsSchema))).toContain(pointer);
  });

  it('refuses a field sent twice instead of picking one', () => {
    expect(pointers(() => readUploadFields({ referenceDbm: ['40', '41'] }, uploadFieldsSchema))).toEqual(['/referenceDbm']);
  });

  it('a pre-check needs a rule set id', () => {
    expect(pointers(() => readUploadFields({}, precheckFieldsSchema))).toEqual(['/ruleSetId']);
    expect(pointers(() => readUploadFields({ ruleSetId: 'not-a-uuid' }, precheckFieldsSchema))).toEqual(['/ruleSetId']);
  });
});
