// Mentions in comments: "@Name" of a mentioned person is highlighted; everything still goes through DOMPurify.
import { describe, expect, it } from 'vitest';
import { renderNote } from './render-note';

const parse = (html: string) => new DOMParser().parseFromString(`<!doctype html><body>${html}</body>`, 'text/html').body;

describe('renderNote with mentions', () => {
  it('wraps "@Name" of the given names in a mention span, longest name first', () => {
    const body = parse(renderNote('Thanks @Teodor Quill and @Teodor, see $p > 2$.', ['Teodor', 'Teodor Quill']));
    expect(Array.from(body.querySelectorAll('.mention')).map((e) => e.textContent)).toEqual(['@Teodor Quill', '@Teodor']);
    expect(body.querySelector('.katex')).not.toBeNull();
  });

  it('leaves other names, longer words, code spans and maths alone', () => {
    const body = parse(renderNote('@Anneke, @Teodorus, `@Teodor` and $@Teodor$', ['Teodor']));
    expect(body.querySelectorAll('.mention')).toHaveLength(0);
  });

  it('escapes a hostile display name and still sanitises the rest', () => {
    const name = '<img src=x onerror=alert(1)>';
    const body = parse(renderNote(`hi @${name} <script>alert(2)</script>`, [name]));
    expect(body.querySelector('.mention')?.textContent).toBe(`@${name}`);
    expect(body.querySelector('img, script')).toBeNull();
    expect(Array.from(body.querySelectorAll('*')).some((e) => Array.from(e.attributes).some((a) => a.name.startsWith('on')))).toBe(false);
  });

  it('renders exactly as before when no names are given', () => {
    expect(renderNote('Hello @Teodor', [])).toBe(renderNote('Hello @Teodor'));
    expect(renderNote('Hello @Teodor')).not.toContain('mention');
  });
});
