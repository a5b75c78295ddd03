import { createToken, Lexer, type TokenType } from 'chevrotain';

// Sift tokens. Mathematical symbols have ASCII spellings so a cell can be typed on any keyboard.

export const WhiteSpace = createToken({ name: 'WhiteSpace', pattern: /[ \t\r\u00a0]+/, group: Lexer.SKIPPED });
export const Comment = createToken({ name: 'Comment', pattern: /\/\/[^\n]*/, group: 'comments' });
export const Newline = createToken({ name: 'Newline', pattern: /\n|;/, line_breaks: true });

/** Any word usable as a record field name (identifiers and keywords alike). */
export const Name = createToken({ name: 'Name', pattern: Lexer.NA });
export const Identifier = createToken({ name: 'Identifier', categories: [Name], pattern: /[A-Za-z_\u0391-\u03A9\u03B1-\u03C9][A-Za-z0-9_\u0391-\u03A9\u03B1-\u03C9']*/ });

const kw = (name: string, pattern: RegExp | string): TokenType =>
  createToken({ name, pattern, longer_alt: Identifier, categories: [Name] });

export const Let = kw('Let', 'let');
export const Claim = kw('Claim', 'claim');
export const Over = kw('Over', 'over');
export const Show = kw('Show', 'show');
export const Draw = kw('Draw', 'draw');
export const As = kw('As', 'as');
export const Digits = kw('Digits', 'digits');
export const If = kw('If', 'if');
export const Then = kw('Then', 'then');
export const Else = kw('Else', 'else');
export const And = kw('And', 'and');
export const Or = kw('Or', 'or');
export const Not = kw('Not', 'not');
export const Mod = kw('Mod', 'mod');
export const Div = kw('Div', 'div');
export const True = kw('True', 'true');
export const False = kw('False', 'false');
export const Primes = kw('Primes', 'primes');
export const In = createToken({ name: 'In', categories: [Name], pattern: /in(?![A-Za-z0-9_'])|∈/ });
export const Sum = createToken({ name: 'Sum', categories: [Name], pattern: /sum(?![A-Za-z0-9_'])|∑/ });
export const Prod = createToken({ name: 'Prod', categories: [Name], pattern: /prod(?![A-Za-z0-9_'])|∏/ });
export const All = createToken({ name: 'All', categories: [Name], pattern: /all(?![A-Za-z0-9_'])|∀/ });
export const Any = createToken({ name: 'Any', categories: [Name], pattern: /any(?![A-Za-z0-9_'])|∃/ });
export const TableOp = kw('TableOp', 'table');

export const NumberLit = createToken({ name: 'NumberLit', pattern: /\d[\d_]*(\.\d[\d_]*)?([eE]\+?\d+)?/ });
export const StringLit = createToken({ name: 'StringLit', pattern: /"(?:[^"\\\n]|\\.)*"/ });

export const DotDot = createToken({ name: 'DotDot', pattern: /\.\.|…/ });
export const Dot = createToken({ name: 'Dot', pattern: '.' });
export const Arrow = createToken({ name: 'Arrow', pattern: /->|→/ });
export const Approx = createToken({ name: 'Approx', pattern: /~=|≈/ });
export const NotEq = createToken({ name: 'NotEq', pattern: /!=|≠/ });
export const LessEq = createToken({ name: 'LessEq', pattern: /<=|≤/ });
export const GreaterEq = createToken({ name: 'GreaterEq', pattern: />=|≥/ });
export const Less = createToken({ name: 'Less', pattern: '<' });
export const Greater = createToken({ name: 'Greater', pattern: '>' });
export const Equals = createToken({ name: 'Equals', pattern: '=' });
export const Plus = createToken({ name: 'Plus', pattern: '+' });
export const Minus = createToken({ name: 'Minus', pattern: /-|−/ });
export const Times = createToken({ name: 'Times', pattern: /\*|·|×/ });
export const Slash = createToken({ name: 'Slash', pattern: '/' });
export const Caret = createToken({ name: 'Caret', pattern: '^' });
export const Hash = createToken({ name: 'Hash', pattern: '#' });
export const Bang = createToken({ name: 'Bang', pattern: '!' });
export const Comma = createToken({ name: 'Comma', pattern: ',' });
export const Colon = createToken({ name: 'Colon', pattern: ':' });
export const LParen = createToken({ name: 'LParen', pattern: '(' });
export const RParen = createToken({ name: 'RParen', pattern: ')' });
export const LBracket = createToken({ name: 'LBracket', pattern: '[' });
export const RBracket = createToken({ name: 'RBracket', pattern: ']' });
export const LBrace = createToken({ name: 'LBrace', pattern: '{' });
export const RBrace = createToken({ name: 'RBrace', pattern: '}' });

/** Order matters: longer operators before their prefixes, keywords before identifiers. */
export const allTokens: TokenType[] = [
  Name,
  WhiteSpace, Comment, Newline,
  Let, Claim, Over, Show, Draw, As, Digits, If, Then, Else, And, Or, Not, Mod, Div, True, False,
  Primes, In, Sum, Prod, All, Any, TableOp,
  Identifier,
  NumberLit, StringLit,
  DotDot, Dot, Arrow, Approx, NotEq, LessEq, GreaterEq, Less, Greater, Equals,
  Plus, Minus, Times, Slash, Caret, Hash, Bang, Comma, Colon,
  LParen, RParen, LBracket, RBracket, LBrace, RBrace,
];

export const siftLexer = new Lexer(allTokens, { positionTracking: 'full', ensureOptimizations: false });
