import { createTransport } from 'nodemailer';
import { crc32 } from 'node:zlib';
import { buildSummaryMessage, SAVINGS_CHART_CID, senderDomain, summaryCharts } from './summary-message';
import type { VersionFigures } from './summary-text';

const figures: VersionFigures[] = [
  {
    number: 1,
    status: 'retired',
    date: '2026-10-03',
    slots: 5,
    keystrokeSavings: 0.31,
    wpmWithout: 1.9,
    wpmWith: 2.2,
  },
  {
    number: 2,
    status: 'active',
    date: '2026-11-03',
    slots: 5,
    keystrokeSavings: 0.42,
    wpmWithout: 1.9,
    wpmWith: 2.72,
  },
];
const input = {
  from: 'Keyloom at Willowmere <keyloom@willowmere.example>',
  to: { name: 'Ann Ashby', email: 'ann@family.example' },
  subject: 'Progress summary for R. Ashby, 2026-10-01 to 2026-11-30',
  text: 'First paragraph.\n\nSecond <paragraph> & more.',
  figures,
  idempotencyKey: '3b0f0d7e-2a41-4f8e-9a3c-5d6e7f809a1b',
  stopUrl: 'http://127.0.0.1:3000/api/summaries/stop/abc_DEF-123',
};

describe('buildSummaryMessage', () => {
  it('uses the idempotency key as Message-ID and carries the stop link in text and HTML', () => {
    const message = buildSummaryMessage(input);
    expect(message.messageId).toBe('<3b0f0d7e-2a41-4f8e-9a3c-5d6e7f809a1b@willowmere.example>');
    expect(message.text).toContain(input.stopUrl);
    expect(message.html).toContain(`<a href="${input.stopUrl}"`);
    expect(message.html).toContain(`<title>${input.subject}</title>`);
    // One column at most 600 px wide, narrowing with the screen (the phone check is the browser test's).
    expect(message.html).toContain('<meta name="viewport" content="width=device-width, initial-scale=1">');
    expect(message.html).toContain('max-width:600px');
    expect(message.html).toContain('Second &lt;paragraph&gt; &amp; more.');
    expect(message.html).not.toMatch(/<script/i);
  });

  it('attaches two PNG charts referenced by Content-ID', () => {
    const message = buildSummaryMessage(input);
    const attachments = message.attachments ?? [];
    expect(attachments.map((a) => a.filename)).toEqual(['keystroke-savings.png', 'typing-speed.png']);
    expect(message.html).toContain(`src="cid:${SAVINGS_CHART_CID}"`);
    // Each chart's figures are also written under it, for readers whose mail program hides images.
    expect(
      (message.html as string).match(
        /<p style="[^"]*">[^<]*\d[^<]*%[^<]*<\/p>|<p style="[^"]*">Estimated words[^<]*<\/p>/g,
      ),
    ).toHaveLength(2);
    // Each image is shown at its CSS width and shrinks on a narrow screen.
    expect(message.html).toMatch(
      /<img src="cid:savings-chart@keyloom" width="600" height="\d+" alt="[^"]*" style="display:block;width:100%;max-width:600px;height:auto;border:0">/,
    );
    for (const a of attachments) {
      const png = a.content as Buffer;
      // 1200 px wide: the PNG's IHDR width (PNG specification, section 11.2.2).
      expect(png.readUInt32BE(16)).toBe(1200);
      expect(png.subarray(1, 4).toString('ascii')).toBe('PNG');
      // The IHDR CRC checked with node:zlib (PNG specification, section 5.3).
      expect(png.readUInt32BE(29)).toBe(crc32(png.subarray(12, 29)) >>> 0);
    }
  });

  it('leaves the charts out when no version has figures', () => {
    const message = buildSummaryMessage({ ...input, figures: [] });
    expect(message.attachments).toEqual([]);
    expect(message.html).not.toContain('<img');
  });

  it('builds a MIME message nodemailer accepts, with the headers in it', async () => {
    // nodemailer's stream transport renders the full message without a server.
    const transport = createTransport({ streamTransport: true, buffer: true, newline: 'unix' });
    const info = await transport.sendMail(buildSummaryMessage(input));
    const mime = (info.message as Buffer).toString('utf8');
    expect(mime).toMatch(/^Message-ID: <3b0f0d7e-2a41-4f8e-9a3c-5d6e7f809a1b@willowmere\.example>$/m);
    expect(mime).toMatch(
      /^List-Unsubscribe: <http:\/\/127\.0\.0\.1:3000\/api\/summaries\/stop\/abc_DEF-123>/m,
    );
    // RFC 8058 §3.1: the header carries exactly this key/value pair.
    expect(mime).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click$/m);
    expect(mime).toMatch(/^Content-ID: <savings-chart@keyloom>$/m);
    expect(mime).toMatch(/^To: Ann Ashby <ann@family\.example>$/m);
  });
});

describe('helpers', () => {
  it('finds the sender domain; the charts carry every figure in their alt texts', () => {
    expect(senderDomain(input.from)).toBe('willowmere.example');
    expect(senderDomain('nobody')).toBe('keyloom.invalid');
    const [savings, speed] = summaryCharts(figures);
    expect(savings?.alt).toBe(
      'Key presses saved by suggestions, by version: version 1: 31%; version 2: 42%.',
    );
    expect(speed?.alt).toContain('version 2: 2.7 with suggestions, 1.9 without suggestions');
    expect([speed?.width, speed?.height]).toEqual([600, expect.any(Number)]);
  });
});
