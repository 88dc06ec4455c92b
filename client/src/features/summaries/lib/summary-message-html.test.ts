import { describe, expect, it } from 'vitest';
import { htmlWithImages } from './summary-message-html';

describe('htmlWithImages', () => {
  it('shows every chart in the order the message references them, and leaves other text alone', () => {
    const html =
      '<p>cid: is not a link here</p><img src="cid:savings-chart@keyloom" alt="a"><img src="cid:speed-chart@keyloom" alt="b">';
    const out = htmlWithImages({
      html,
      charts: [
        { name: 'a.png', alt: 'a', pngBase64: 'AAA', width: 600, height: 300 },
        { name: 'b.png', alt: 'b', pngBase64: 'BBB', width: 600, height: 300 },
      ],
    });
    expect(out).toBe(
      '<p>cid: is not a link here</p><img src="data:image/png;base64,AAA" alt="a"><img src="data:image/png;base64,BBB" alt="b">',
    );
  });
});
