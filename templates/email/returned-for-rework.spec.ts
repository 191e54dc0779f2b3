import { returnedForReworkEmail } from './returned-for-rework';

const input = {
  engineerName: 'Ben Bench',
  labName: 'Harbour RF Lab',
  runNumber: 'RUN-000042',
  deviceLabel: 'Gullwing Marine GX-150 (s/n GX-0001)',
  reviewerName: 'Ada Reviewer',
  reason: 'Carrier read with 1 kHz RBW; repeat at 10 Hz.',
  runUrl: 'http://127.0.0.1:4610/runs/3f6c',
};

describe('returnedForReworkEmail', () => {
  it('carries the reviewer’s reason word for word and links to the run in both parts', () => {
    const mail = returnedForReworkEmail(input);
    expect(mail.subject).toBe('Run RUN-000042 was returned for rework: Gullwing Marine GX-150 (s/n GX-0001)');
    expect(mail.text).toContain('Reason: Carrier read with 1 kHz RBW; repeat at 10 Hz.');
    expect(mail.text).toContain('Open the run: http://127.0.0.1:4610/runs/3f6c');
    expect(mail.html).toContain('Ada Reviewer');
    expect(mail.html).toContain('href="http://127.0.0.1:4610/runs/3f6c"');
  });

  it('escapes the reason in the HTML part', () => {
    const mail = returnedForReworkEmail({ ...input, reason: 'PEP < 50 dBm & "odd" <script>' });
    expect(mail.html).not.toContain('<script>');
    expect(mail.html).toContain('PEP &lt; 50 dBm &amp; &quot;odd&quot; &lt;script&gt;');
    expect(mail.text).toContain('PEP < 50 dBm & "odd" <script>');
  });
});
