import { stopFormPage, stoppedPage, unknownStopPage, whatHappensNext } from './stop-page';

const clinic = { name: 'Larchfield Speech & Access', phone: '+44 (0)1632 960 731' };
const fonts = { regular: '/assets/atkinson-hyperlegible-latin-400-normal-abc.woff2', bold: null };
const TOKEN = 'a'.repeat(43);

describe('stop pages', () => {
  it('says what happens next with the preferred name, the clinic and a number a phone can dial', () => {
    expect(whatHappensNext({ clinic, fonts, clientName: 'Sam' })).toBe(
      'You will get no more progress e-mails about Sam from Larchfield Speech &amp; Access. ' +
        'To start them again, contact the clinic on <a href="tel:+4401632960731">+44 (0)1632 960 731</a>.',
    );
  });

  it('says "this client" without a preferred name, and leaves the number out when there is none', () => {
    expect(whatHappensNext({ clinic: { name: 'the clinic', phone: '' }, fonts, clientName: null })).toBe(
      'You will get no more progress e-mails about this client from the clinic. ' +
        'To start them again, contact the clinic.',
    );
  });

  it('escapes every value that people type (HTML special characters, OWASP XSS prevention rule 1)', () => {
    const html = stopFormPage(TOKEN, {
      clinic: { name: '<script>x</script>', phone: '01632 960 731' },
      fonts,
      clientName: '"Bo" <b>',
    });
    expect(html).not.toContain('<script>');
    expect(html).not.toContain('<b>');
    expect(html).toContain('&lt;script&gt;x&lt;/script&gt;');
    expect(html).toContain('&quot;Bo&quot; &lt;b&gt;');
  });

  it('posts the button to its own address, and loads only the font files it was given', () => {
    const html = stopFormPage(TOKEN, { clinic, fonts, clientName: 'Sam' });
    expect(html).toContain(`<form method="post" action="${TOKEN}"`);
    expect(html).toContain('<button type="submit">Stop these e-mails</button>');
    expect(html.match(/@font-face/g)).toHaveLength(1);
    expect(html).toContain(`url('${fonts.regular}')`);
    // A 48 px target at least: 3.25rem of an 18 px root (112.5% of 16 px) is 58.5 px.
    expect(html).toMatch(/button\{[^}]*min-height:3\.25rem/);
    expect(html).not.toMatch(/<script/);
  });

  it('falls back to the system font when the web app is not built', () => {
    const html = stoppedPage({ clinic, fonts: { regular: null, bold: null }, clientName: null });
    expect(html).not.toContain('@font-face');
    expect(html).toContain('<h1>Progress e-mails stopped</h1>');
    expect(unknownStopPage({ clinic, fonts })).toContain('This stop link is not known.');
  });
});
