import { composeMail } from './compose-mail';

describe('composeMail', () => {
  const mail = composeMail({
    greeting: 'Hello,',
    intro: ['Ilse <Marenko> invites you to "Twin gaps & sums".'],
    quote: 'Please check\nthe range.',
    link: { href: 'http://127.0.0.1:4310/invitations/abc_DEF-123?x=1&y=2', label: 'Open the invitation' },
    outro: ['The link works once.'],
  });

  it('has a text part with the bare link and the same words', () => {
    expect(mail.text).toContain('Open the invitation: http://127.0.0.1:4310/invitations/abc_DEF-123?x=1&y=2');
    expect(mail.text).toContain('Ilse <Marenko> invites you to "Twin gaps & sums".');
    expect(mail.text).toContain('> Please check\n> the range.');
    expect(mail.text).not.toMatch(/<a |<p/);
  });

  it('has an HTML part with a clickable link and every piece of text escaped', () => {
    expect(mail.html).toContain('<a href="http://127.0.0.1:4310/invitations/abc_DEF-123?x=1&amp;y=2"');
    expect(mail.html).toMatch(/>Open the invitation<\/a>/);
    expect(mail.html).toContain('Ilse &lt;Marenko&gt; invites you to &quot;Twin gaps &amp; sums&quot;.');
    expect(mail.html).not.toContain('<Marenko>');
    expect(mail.html).toContain('Please check<br>the range.');
    // Nothing loads from elsewhere.
    expect(mail.html).not.toMatch(/<img|<link|src=|url\(/);
  });
});
