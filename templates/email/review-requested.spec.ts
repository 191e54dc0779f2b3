import { reviewRequestedEmail } from './review-requested';

const input = {
  reviewerName: 'Ada Reviewer',
  labName: 'Harbour RF Lab',
  runNumber: 'RUN-000042',
  deviceLabel: 'Gullwing Marine GX-150 (s/n GX-0001)',
  clientName: 'Gullwing Marine',
  submittedByName: 'Ben Bench',
  reviewUrl: 'http://127.0.0.1:4610/runs/3f6c/review',
};

describe('reviewRequestedEmail', () => {
  it('names the run, the device and who submitted it, and links to the review screen in both parts', () => {
    const mail = reviewRequestedEmail(input);
    expect(mail.subject).toBe('Run RUN-000042 is ready for review: Gullwing Marine GX-150 (s/n GX-0001)');
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('RUN-000042');
      expect(part).toContain('Gullwing Marine GX-150 (s/n GX-0001)');
      expect(part).toContain('Ben Bench');
      expect(part).toContain('http://127.0.0.1:4610/runs/3f6c/review');
    }
    expect(mail.html).toContain('href="http://127.0.0.1:4610/runs/3f6c/review"');
  });

  it('escapes the device label in the HTML part (labels are typed by people)', () => {
    const mail = reviewRequestedEmail({ ...input, deviceLabel: '<b>TX</b> & co' });
    expect(mail.html).not.toContain('<b>TX</b>');
    expect(mail.html).toContain('&lt;b&gt;TX&lt;/b&gt; &amp; co');
  });
});
