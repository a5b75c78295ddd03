import Editor, { type OnMount } from '@monaco-editor/react';
import { Box } from '@mui/material';
import { useEffect, useRef } from 'react';
import { monoFont } from '../../lib/design-tokens';
import { siftService } from './lang-adapter';
import { monaco, SIFT_THEME } from './monaco-offline';
import { registerSift, SIFT_LANGUAGE_ID, updateDiagnostics } from './register-sift';

registerSift(monaco, siftService);

export interface SiftEditorProps {
  value: string;
  onChange: (value: string) => void;
  /** Ctrl/Cmd+Enter, with the editor's text at that moment (state may lag the last keystrokes). */
  onRun?: (text: string) => void;
  /** Ctrl/Cmd+S, with the editor's text at that moment. */
  onSave?: (text: string) => void;
  /** Ctrl/Cmd+Alt+N: a new cell below this one. */
  onAddBelow?: () => void;
  /** The editor gained (true) or lost (false) the keyboard focus (presence: who edits which cell). */
  onFocusChange?: (focused: boolean) => void;
  readOnly?: boolean;
  /** Accessible name of the editing area. */
  label: string;
  /** Change it to replace the editor's text with `value` (otherwise `value` is only the initial text). */
  replaceKey?: number;
  /** A model path unique to the cell, so each cell keeps its own undo history. */
  path: string;
  language?: string;
}

const LINE_HEIGHT = 19;

type Shortcut = 'run' | 'save' | 'addBelow';

/** Ctrl/Cmd+Enter runs, Ctrl/Cmd+S saves, Ctrl/Cmd+Alt+N adds a query below (the hint line says so). */
function shortcutFor(e: { ctrlKey: boolean; metaKey: boolean; altKey: boolean; shiftKey: boolean; keyCode: number }): Shortcut | null {
  const { KeyCode } = monaco;
  if (!(e.ctrlKey || e.metaKey) || e.shiftKey) return null;
  if (e.altKey) return e.keyCode === KeyCode.KeyN ? 'addBelow' : null;
  if (e.keyCode === KeyCode.Enter) return 'run';
  if (e.keyCode === KeyCode.KeyS) return 'save';
  return null;
}

/** Monaco with the Sift mode; grows with its content (3 to 30 lines). Loaded lazily. */
export default function SiftEditor({ value, replaceKey, onChange, onRun, onSave, onAddBelow, onFocusChange, readOnly, label, path, language = SIFT_LANGUAGE_ID }: SiftEditorProps) {
  // Latest callbacks for the commands registered once at mount.
  const handlers = useRef({ onRun, onSave, onAddBelow, onFocusChange });
  handlers.current = { onRun, onSave, onAddBelow, onFocusChange };
  const editorRef = useRef<Parameters<OnMount>[0] | null>(null);
  // The editor owns its text while typing (a controlled value lags keystrokes and would undo them);
  // the parent replaces the text (taking the saved version) by changing `replaceKey`.
  useEffect(() => {
    const editor = editorRef.current;
    if (editor && replaceKey !== undefined && editor.getValue() !== value) editor.setValue(value);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only a new replaceKey pushes the value in
  }, [replaceKey]);
  const lines = Math.min(30, Math.max(3, value.split('\n').length + 1));

  const onMount: OnMount = (editor) => {
    editorRef.current = editor;
    // Keys are handled by this editor's own key listener: `addCommand` bindings are shared by every
    // editor on the page (the last one created wins), so Ctrl+Enter in cell 1 would run the last cell.
    editor.onDidFocusEditorText(() => handlers.current.onFocusChange?.(true));
    editor.onDidBlurEditorText(() => handlers.current.onFocusChange?.(false));
    editor.onKeyDown((e) => {
      const action = shortcutFor(e);
      if (!action) return;
      e.preventDefault();
      e.stopPropagation();
      const h = handlers.current;
      if (action === 'run') h.onRun?.(editor.getValue());
      else if (action === 'save') h.onSave?.(editor.getValue());
      else h.onAddBelow?.();
    });
    const model = editor.getModel();
    if (model && language === SIFT_LANGUAGE_ID) updateDiagnostics(monaco, model, siftService);
  };

  // Diagnostics follow the text, a little after typing stops.
  useEffect(() => {
    const model = editorRef.current?.getModel();
    if (!model || language !== SIFT_LANGUAGE_ID) return;
    const t = window.setTimeout(() => updateDiagnostics(monaco, model, siftService), 250);
    return () => window.clearTimeout(t);
  }, [value, language]);

  return (
    <Box sx={{ border: 1, borderColor: 'divider', borderRadius: 1, overflow: 'hidden', '&:focus-within': { borderColor: 'primary.main' } }}>
      <Editor
        height={lines * LINE_HEIGHT + 8}
        language={language}
        path={path}
        theme={SIFT_THEME}
        defaultValue={value}
        onChange={(v) => onChange(v ?? '')}
        onMount={onMount}
        loading={null}
        options={{
          ariaLabel: label,
          readOnly,
          minimap: { enabled: false },
          fontFamily: monoFont,
          fontSize: 13,
          lineHeight: LINE_HEIGHT,
          lineNumbersMinChars: 3,
          scrollBeyondLastLine: false,
          wordWrap: 'on',
          renderLineHighlight: 'line',
          overviewRulerLanes: 0,
          tabSize: 2,
          automaticLayout: true,
          fixedOverflowWidgets: true,
          padding: { top: 4, bottom: 4 },
          scrollbar: { alwaysConsumeMouseWheel: false },
          tabFocusMode: false,
        }}
      />
    </Box>
  );
}
