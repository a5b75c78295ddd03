import { GREEK_LATEX } from '@cribra/lang';

/**
 * Characters beyond ASCII that a Cribra document may hold, as pdflatex commands: the symbols the
 * Sift lexer accepts (∈ ∑ ∏ ∀ ∃ … → ≈ ≠ ≤ ≥ − · ×, no-break space, Greek letters) and the usual
 * typography of notes. Each entry is maths (set with \ensuremath in text) or text. pdflatex with
 * [utf8]{inputenc} stops at any character it does not know, so every other character outside the
 * accented Latin letters is written as its code point instead ([U+2603]).
 */
const MATH: Record<string, string> = {
  '∈': '\\in', '∉': '\\notin', '∑': '\\sum', '∏': '\\prod', '∀': '\\forall', '∃': '\\exists', '→': '\\to', '←': '\\leftarrow',
  '↔': '\\leftrightarrow', '↦': '\\mapsto', '⇒': '\\Rightarrow', '⇔': '\\Leftrightarrow', '≈': '\\approx', '≠': '\\neq',
  '≤': '\\le', '≥': '\\ge', '−': '-', '·': '\\cdot', '×': '\\times', '÷': '\\div', '±': '\\pm', '∓': '\\mp', '≡': '\\equiv',
  '∼': '\\sim', '≪': '\\ll', '≫': '\\gg', '∞': '\\infty', '√': '\\surd', '∩': '\\cap', '∪': '\\cup', '⊂': '\\subset',
  '⊆': '\\subseteq', '⊃': '\\supset', '⊇': '\\supseteq', '∅': '\\emptyset', '∘': '\\circ', '∣': '\\mid', '∤': '\\nmid',
  '′': '\\prime', '″': '\\prime\\prime', '∂': '\\partial', '∫': '\\int', '⌊': '\\lfloor', '⌋': '\\rfloor', '⌈': '\\lceil',
  '⌉': '\\rceil', '⟨': '\\langle', '⟩': '\\rangle', 'ℕ': '\\mathbb{N}', 'ℤ': '\\mathbb{Z}', 'ℚ': '\\mathbb{Q}', 'ℝ': '\\mathbb{R}',
  'ℂ': '\\mathbb{C}', 'ℙ': '\\mathbb{P}', '¬': '\\neg', '∧': '\\wedge', '∨': '\\vee', '°': '^{\\circ}', 'µ': '\\mu',
  '⁰': '^{0}', '¹': '^{1}', '²': '^{2}', '³': '^{3}', '⁴': '^{4}', '⁵': '^{5}', '⁶': '^{6}', '⁷': '^{7}', '⁸': '^{8}', '⁹': '^{9}',
  '₀': '_{0}', '₁': '_{1}', '₂': '_{2}', '₃': '_{3}', '₄': '_{4}', '₅': '_{5}', '₆': '_{6}', '₇': '_{7}', '₈': '_{8}', '₉': '_{9}',
  ...GREEK_LATEX,
};

const TEXT: Record<string, string> = {
  '\u00a0': '~', '\u2009': '\\,', '\u202f': '\\,', '\u2002': '\\enspace', '\u2003': '\\quad', '\u200b': '',
  '–': '--', '—': '---', '‑': '-', '‐': '-', '‘': '`', '’': "'", '“': '``', '”': "''", '„': ',,', '…': '\\ldots{}',
  '•': '\\textbullet{}', '§': '\\S{}', '¶': '\\P{}', '©': '\\copyright{}', '†': '\\dag{}', '‡': '\\ddag{}', '½': '\\ensuremath{\\tfrac12}',
  '¼': '\\ensuremath{\\tfrac14}', '¾': '\\ensuremath{\\tfrac34}', 'ß': '\\ss{}', 'æ': '\\ae{}', 'Æ': '\\AE{}', 'œ': '\\oe{}',
  'Œ': '\\OE{}', 'ø': '\\o{}', 'Ø': '\\O{}', 'å': '\\aa{}', 'Å': '\\AA{}', 'ł': '\\l{}', 'Ł': '\\L{}', 'ı': '\\i{}',
};

// Letters with accents that pdflatex composes itself from [utf8]{inputenc} (OT1 fonts, no extra font packages).
const ACCENTED = /[À-ÏÑ-ÖÙ-Ýà-ïñ-öù-ýÿčćšžřěňťďůőűĉĝĥĵŝŭąęńśźżğşĺľŕ]/;

const codePoint = (c: string): string => `[U+${c.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}]`;

/** Every character the tables know (for tests and for the listing's literate option). */
export const MAPPED_CHARACTERS: readonly string[] = [...Object.keys(MATH), ...Object.keys(TEXT)];

/** Running text for LaTeX: specials escaped, symbols as commands, unknown characters as their code point. */
export function latexText(s: string): string {
  let out = '';
  for (const c of s) {
    if (c === '\\') out += '\\textbackslash{}';
    else if (c === '^') out += '\\textasciicircum{}';
    else if (c === '~') out += '\\textasciitilde{}';
    else if ('{}$&#_%'.includes(c)) out += `\\${c}`;
    // The default (OT1) text fonts have no < > | : set them as maths.
    else if (c === '<' || c === '>' || c === '|') out += `\\ensuremath{${c === '|' ? '\\vert' : c}}`;
    else if (c === '\t') out += ' ';
    else if (c === '\r') continue;
    else if (c.charCodeAt(0) < 0x80) out += c;
    else if (MATH[c] !== undefined) out += `\\ensuremath{${MATH[c]}}`;
    else if (TEXT[c] !== undefined) out += TEXT[c];
    else if (ACCENTED.test(c)) out += c;
    else out += `\\texttt{${codePoint(c)}}`;
  }
  return out;
}

/**
 * The inside of a `$…$` written by a note's author: TeX as written, with the Unicode symbols that
 * pdflatex cannot read replaced by their commands (the web app's maths renderer accepts them).
 */
export function latexMath(tex: string): string {
  let out = '';
  for (const c of tex) {
    if (c.charCodeAt(0) < 0x80) out += c;
    else if (MATH[c] !== undefined) out += `${MATH[c]} `;
    else if (c === '\u00a0' || c === '\u2009' || c === '\u202f') out += '\\,';
    else out += `\\text{${latexText(c)}}`;
  }
  return out;
}

/** Source text for a listing: tabs as spaces, characters the listing cannot map as their code point. */
export function listingText(source: string): string {
  let out = '';
  for (const c of source.replace(/\r/g, '').replace(/\t/g, '  ')) {
    out += c.charCodeAt(0) < 0x80 || MATH[c] !== undefined || TEXT[c] !== undefined ? c : codePoint(c);
  }
  return out;
}

/** The `literate` option of the listings package: each mapped character typeset by its command. */
export function listingLiterate(): string {
  const entries = [
    ...Object.entries(MATH).map(([c, cmd]) => `{${c}}{{$${cmd}$}}1`),
    ...Object.entries(TEXT).map(([c, cmd]) => `{${c}}{{${cmd === '' ? '{}' : cmd}}}1`),
  ];
  return entries.join(' ');
}
