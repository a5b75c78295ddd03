import { DiffEditor, type DiffOnMount } from '@monaco-editor/react';
import { Box } from '@mui/material';
import { monoFont } from '../../lib/design-tokens';
import { monaco, SIFT_THEME } from './monaco-offline';
import { registerSift, SIFT_LANGUAGE_ID } from './register-sift';
import { siftService } from './lang-adapter';

registerSift(monaco, siftService);

export interface SiftDiffEditorProps {
  /** Left, read-only: the saved text. */
  original: string;
  /** Right, editable: the author's text, which becomes the merge. */
  modified: string;
  /** Called with a reader of the right-hand text (the merge as edited now). */
  onReady?: (readMerged: () => string) => void;
  language?: string;
  /** Accessible names of the two sides. */
  originalLabel: string;
  modifiedLabel: string;
  /** Model paths unique to this conflict (keeps them apart from the cell's own editor model). */
  path: string;
}

/** Monaco's side-by-side diff: saved text on the left, the author's (editable) on the right. Loaded lazily. */
export default function SiftDiffEditor({ original, modified, onReady, language = SIFT_LANGUAGE_ID, originalLabel, modifiedLabel, path }: SiftDiffEditorProps) {
  const lines = Math.min(30, Math.max(4, Math.max(original.split('\n').length, modified.split('\n').length) + 1));
  const onMount: DiffOnMount = (editor) => {
    editor.getOriginalEditor().updateOptions({ ariaLabel: originalLabel });
    editor.getModifiedEditor().updateOptions({ ariaLabel: modifiedLabel });
    onReady?.(() => editor.getModifiedEditor().getValue());
  };
  return (
    <Box sx={{ border: 1, borderColor: 'divider', borderRadius: 1, overflow: 'hidden' }}>
      <DiffEditor
        height={lines * 19 + 8}
        language={language}
        original={original}
        modified={modified}
        originalModelPath={`${path}.saved`}
        modifiedModelPath={`${path}.mine`}
        theme={SIFT_THEME}
        onMount={onMount}
        loading={null}
        options={{
          renderSideBySide: true,
          useInlineViewWhenSpaceIsLimited: false,
          originalEditable: false,
          readOnly: false,
          minimap: { enabled: false },
          fontFamily: monoFont,
          fontSize: 13,
          lineHeight: 19,
          scrollBeyondLastLine: false,
          wordWrap: 'on',
          automaticLayout: true,
          renderOverviewRuler: false,
          scrollbar: { alwaysConsumeMouseWheel: false },
        }}
      />
    </Box>
  );
}
