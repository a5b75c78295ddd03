import { invitationMail } from './invitation-mail';

describe('invitationMail', () => {
  const m = invitationMail({
    inviterName: 'Ilse Marenko', notebookTitle: 'Quintuplets', role: 'reviewer', message: 'Please look at cell 2.',
    link: 'http://127.0.0.1:4310/invitations/tok_123', expires: '2026-12-11',
  });

  it('sends a text part and an HTML part with a clickable link to the invitation', () => {
    expect(m.subject).toBe('Ilse Marenko invites you to the Cribra notebook "Quintuplets"');
    expect(m.text).toContain('http://127.0.0.1:4310/invitations/tok_123');
    expect(m.text).toContain('as reviewer');
    expect(m.text).toContain('> Please look at cell 2.');
    expect(m.html).toMatch(/<a href="http:\/\/127\.0\.0\.1:4310\/invitations\/tok_123"[^>]*>Sign in \(or create an account with this address\) and join<\/a>/);
    expect(m.html).toContain('expires on 2026-12-11 (7 days)');
  });
});
