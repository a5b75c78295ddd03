// Hostile notes and comments: the API stores text as written, so everything rests on this renderer.
// Each vector is rendered, parsed back into a DOM and searched for anything that could run script.
import { describe, expect, it } from 'vitest';
import { renderNote } from './render-note';

const VECTORS = [
  '<script>alert(1)</script>',
  '<SCRIPT SRC=//x/x.js></SCRIPT>',
  '<img src=x onerror=alert(1)>',
  '<svg onload=alert(1)><circle r=1 /></svg>',
  '<svg><a xlink:href="javascript:alert(1)"><text y="9">x</text></a></svg>',
  '<svg><script>alert(1)</script></svg>',
  '<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>',
  '<iframe src="javascript:alert(1)"></iframe>',
  '<iframe srcdoc="<script>alert(1)</script>"></iframe>',
  '<object data="data:text/html,<script>alert(1)</script>"></object>',
  '<embed src="javascript:alert(1)">',
  '<form action="javascript:alert(1)"><button>go</button></form>',
  '<a href="javascript:alert(1)">x</a>',
  '<a href="JaVaScRiPt&#58;alert(1)">x</a>',
  '<a href="&#x6A;avascript:alert(1)">x</a>',
  '<a href="vbscript:msgbox(1)">x</a>',
  '<a href="data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==">x</a>',
  '[link](javascript:alert(1))',
  '[link](<javascript:alert(1)>)',
  '![img](javascript:alert(1))',
  '![x](x" onerror="alert(1))',
  '<div style="background:url(javascript:alert(1))">x</div>',
  '<base href="javascript:alert(1)//">',
  '<meta http-equiv="refresh" content="0;url=javascript:alert(1)">',
  '<details open ontoggle=alert(1)>',
  '<input autofocus onfocus=alert(1)>',
  '<body onload=alert(1)>',
  '<p>text</p><!--><script>alert(1)</script>-->',
  '`<script>alert(1)</script>` and ```\n<script>alert(1)</script>\n```',
  '$\\href{javascript:alert(1)}{x}$',
  '$$\\url{javascript:alert(1)}$$',
  '$\\htmlData{onload=alert(1)}{x}$',
  '$\\includegraphics{javascript:alert(1)}$',
  '$<img src=x onerror=alert(1)>$',
  '<noscript><p title="</noscript><img src=x onerror=alert(1)>">',
  '<a href="https://example.org" target="_blank">fine</a>',
];

const BAD_ELEMENTS = ['script', 'iframe', 'object', 'embed', 'form', 'base', 'meta', 'link', 'frame', 'frameset', 'applet'];
// Inline style stays (KaTeX lays out maths with it); no current browser runs javascript: inside CSS url().
const BAD_URL = /^\s*(javascript|vbscript|data:text\/html)/i;

function dangers(html: string): string[] {
  const doc = new DOMParser().parseFromString(`<!doctype html><body>${html}</body>`, 'text/html');
  const found: string[] = [];
  for (const el of Array.from(doc.body.querySelectorAll('*'))) {
    const tag = el.localName.toLowerCase();
    if (BAD_ELEMENTS.includes(tag)) found.push(`<${tag}>`);
    for (const a of Array.from(el.attributes)) {
      const name = a.name.toLowerCase();
      if (name.startsWith('on')) found.push(`${tag}[${name}]`);
      if (['href', 'src', 'xlink:href', 'action', 'formaction', 'data', 'srcdoc'].includes(name) && BAD_URL.test(a.value)) found.push(`${tag}[${name}=${a.value}]`);
      if (name === 'srcdoc') found.push(`${tag}[srcdoc]`);
    }
  }
  return found;
}

describe('hostile notes and comments render without script', () => {
  it.each(VECTORS)('%s', (source) => {
    let html = '';
    expect(() => (html = renderNote(source))).not.toThrow();
    expect(dangers(html)).toEqual([]);
  });

  it('keeps the harmless part of a note (text and a plain link)', () => {
    const html = renderNote('Twin primes <script>alert(1)</script> **stay** [here](https://example.org).');
    expect(html).toContain('<strong>stay</strong>');
    expect(html).toContain('href="https://example.org"');
    expect(html).not.toContain('alert(1)</script>');
  });

  it('the checker itself finds what it looks for', () => {
    expect(dangers('<img src=x onerror=alert(1)><a href="javascript:x">y</a><script></script>')).toHaveLength(3);
  });

  it('renders a megabyte of nested emphasis and brackets in bounded time', () => {
    const started = Date.now();
    const html = renderNote(`${'*['.repeat(20_000)}x${']*'.repeat(20_000)}\n${'> '.repeat(2_000)}deep <script>alert(1)</script>`);
    expect(Date.now() - started).toBeLessThan(10_000);
    expect(html).toContain('deep');
    expect(dangers(html)).toEqual([]);
  });
});
