// Monaco from the local package, never from a CDN (see the team's stack notes). Only the base
// editor worker is bundled: Sift's services run on the main thread and need no language worker.
import { loader } from '@monaco-editor/react';
import EditorWorker from 'monaco-editor/editor/editor.worker?worker';
import { palette } from '../../lib/design-tokens';
import { monaco } from './monaco-core';

self.MonacoEnvironment = { getWorker: () => new EditorWorker() };
loader.config({ monaco });

export const SIFT_THEME = 'cribra-paper';

const hex = (c: string) => c.replace('#', '');

monaco.editor.defineTheme(SIFT_THEME, {
  base: 'vs',
  inherit: true,
  rules: [
    { token: 'keyword.sift', foreground: hex(palette.accentDark), fontStyle: 'bold' },
    { token: 'predefined.sift', foreground: '4b5d8a' },
    { token: 'number.sift', foreground: '8a5a2b' },
    { token: 'string.sift', foreground: '5f6b2e' },
    { token: 'comment.sift', foreground: '7d7a70', fontStyle: 'italic' },
    { token: 'operator.sift', foreground: hex(palette.ink) },
    { token: 'delimiter.sift', foreground: hex(palette.inkSoft) },
  ],
  colors: {
    'editor.background': palette.sheet,
    'editor.lineHighlightBackground': '#f1ede2',
    'editorLineNumber.foreground': '#a9a396',
    'editorGutter.background': palette.sheet,
  },
});

export { monaco };
