import { uploadPlan } from './upload-plan';

const text = (s: string) => new TextEncoder().encode(s);
// RIFF/WAVE signature bytes: the WAVE file format (Microsoft/IBM Multimedia Programming Interface, 1991).
const wavHead = () => {
  const b = new Uint8Array(44);
  b.set(text('RIFF'), 0);
  b.set(text('WAVE'), 8);
  return b;
};
const binary = () => Uint8Array.from([0, 0, 128, 63, 0, 0, 0, 0]);
const BOTH = ['trace', 'iq'] as const;

describe('uploadPlan', () => {
  it('reads a delimited trace as a trace CSV', () => {
    expect(uploadPlan([{ name: 'mask.csv', firstBytes: text('# RBW: 300 Hz\nfrequency_hz,level_dbm\n1,2\n') }], BOTH)).toMatchObject({ ok: true, format: 'trace-csv', order: [0], evidence: 'trace', needsSampleRate: false });
  });

  it('orders a SigMF pair metadata first, whatever order they were chosen in (SigMF: .sigmf-meta + .sigmf-data)', () => {
    const plan = uploadPlan([{ name: 'tone.sigmf-data', firstBytes: binary() }, { name: 'tone.sigmf-meta', firstBytes: text('{"global":{"core:datatype":"cf32_le"}}') }], BOTH);
    expect(plan).toMatchObject({ ok: true, format: 'sigmf', order: [1, 0], needsSampleRate: false, evidence: 'iq' });
  });

  it('asks for the rate of headerless samples but not of a WAV, which states it', () => {
    expect(uploadPlan([{ name: 'cap.cf32', firstBytes: binary() }], BOTH)).toMatchObject({ ok: true, format: 'cf32', needsSampleRate: true });
    expect(uploadPlan([{ name: 'cap.ci16', firstBytes: binary() }], BOTH)).toMatchObject({ ok: true, format: 'ci16', needsSampleRate: true });
    expect(uploadPlan([{ name: 'cap.wav', firstBytes: wavHead() }], BOTH)).toMatchObject({ ok: true, format: 'wav', needsSampleRate: false });
  });

  it('explains what is missing or wrong instead of sending it', () => {
    expect(uploadPlan([], BOTH)).toEqual({ ok: false, message: 'Choose a file first.' });
    expect(uploadPlan([{ name: 'a.sigmf-meta', firstBytes: text('{"global":{}}') }], BOTH)).toMatchObject({ ok: false, message: expect.stringMatching(/\.sigmf-data/) });
    expect(uploadPlan([{ name: 'a.csv', firstBytes: text('a,b') }, { name: 'b.csv', firstBytes: text('a,b') }], BOTH)).toMatchObject({ ok: false, message: expect.stringMatching(/SigMF/) });
    expect(uploadPlan([{ name: 'photo.jpg', firstBytes: Uint8Array.from([0xff, 0xd8, 0xff, 0xe0]) }], BOTH)).toMatchObject({ ok: false, message: expect.stringMatching(/photo\.jpg is not a file/) });
  });

  it('refuses evidence the test case cannot be judged from', () => {
    expect(uploadPlan([{ name: 'cap.wav', firstBytes: wavHead() }], ['trace'])).toMatchObject({ ok: false, message: expect.stringMatching(/spectrum-analyzer trace/) });
    expect(uploadPlan([{ name: 'm.csv', firstBytes: text('f,l\n') }], ['iq'])).toMatchObject({ ok: false, message: expect.stringMatching(/I\/Q capture/) });
  });
});
