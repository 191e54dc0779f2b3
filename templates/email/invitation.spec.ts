import { invitationEmail } from './invitation';
import { passwordResetEmail } from './password-reset';

const url = 'http://127.0.0.1:4610/invitations/abcDEF_-123';

describe('invitationEmail', () => {
  it('names the organization, the role and the link in both the text and the HTML part', () => {
    const mail = invitationEmail({ kind: 'member', organizationName: 'Harbour RF Lab', inviterName: 'Ada Admin', roleLabel: 'Test engineer', acceptUrl: url, expiresOn: '2026-12-08' });
    expect(mail.subject).toBe('You are invited to join Harbour RF Lab on Sidecheck');
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain(url);
      expect(part).toContain('Test engineer');
      expect(part).toContain('2026-12-08');
    }
  });

  it('escapes names in the HTML part (an organization name is typed by people)', () => {
    const mail = invitationEmail({ kind: 'member', organizationName: '<script>x</script> & Co', inviterName: 'A', roleLabel: 'Billing', acceptUrl: url, expiresOn: '2026-12-08' });
    expect(mail.html).not.toContain('<script>');
    expect(mail.html).toContain('&lt;script&gt;x&lt;/script&gt; &amp; Co');
  });

  it('describes an auditor grant with its scope, last day and note, and leaves out an absent note', () => {
    const base = { kind: 'auditor' as const, organizationName: 'Harbour RF Lab', inviterName: 'Ada Admin', scopeText: 'all the test reports it has issued', accessUntil: '2027-01-31', acceptUrl: url, expiresOn: '2026-12-08' };
    const withNote = invitationEmail({ ...base, note: 'Surveillance visit' });
    expect(withNote.text).toContain('read-only access to all the test reports it has issued until 2027-01-31');
    expect(withNote.text).toContain('Their note: Surveillance visit');
    expect(invitationEmail({ ...base, note: null }).text).not.toContain('Their note');
  });
});

describe('passwordResetEmail', () => {
  it('carries the link and how long it works', () => {
    const mail = passwordResetEmail({ name: 'Ada', resetUrl: 'http://127.0.0.1:4610/password-reset/tok', validMinutes: 60 });
    expect(mail.text).toContain('http://127.0.0.1:4610/password-reset/tok');
    expect(mail.text).toContain('60 minutes');
    expect(mail.html).toContain('href="http://127.0.0.1:4610/password-reset/tok"');
  });
});
