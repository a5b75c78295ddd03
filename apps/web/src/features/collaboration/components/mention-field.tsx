import type { UserRef } from '@cribra/contracts';
import { List, ListItemButton, Paper, TextField } from '@mui/material';
import { type KeyboardEvent, type ReactNode, type SyntheticEvent, useId, useLayoutEffect, useRef, useState } from 'react';
import { matchMembers, mentionQueryAt } from '../lib/mentions';

interface Props {
  label: string;
  value: string;
  onChange: (value: string) => void;
  /** People who can be mentioned (the notebook's members). */
  members: UserRef[];
  /** Called when a member is picked from the list; the text then holds "@Name". */
  onPick: (member: UserRef) => void;
  helperText?: ReactNode;
  error?: boolean;
  minRows?: number;
  autoFocus?: boolean;
  disabled?: boolean;
}

/** A multi-line comment box: typing "@" and letters lists matching members to pick with keys or mouse. */
export function MentionField({ label, value, onChange, members, onPick, helperText, error, minRows, autoFocus, disabled }: Props) {
  const listId = useId();
  const inputRef = useRef<HTMLTextAreaElement | null>(null);
  const pendingCaret = useRef<number | null>(null);
  const [caret, setCaret] = useState<number | null>(null);
  const [active, setActive] = useState(0);
  // Escape hides the list for the "@…" it was showing until something else is typed.
  const [dismissed, setDismissed] = useState<string | null>(null);

  const found = caret === null ? null : mentionQueryAt(value, caret);
  const options = found ? matchMembers(members, found.query) : [];
  const open = !!found && options.length > 0 && dismissed !== `${found.start}:${found.query}`;
  const current = Math.min(active, options.length - 1);

  useLayoutEffect(() => {
    const at = pendingCaret.current;
    if (at === null || !inputRef.current) return;
    pendingCaret.current = null;
    inputRef.current.focus();
    inputRef.current.setSelectionRange(at, at);
  }, [value]);

  const trackCaret = (e: SyntheticEvent<HTMLTextAreaElement | HTMLInputElement>) => setCaret(e.currentTarget.selectionStart);

  const pick = (member: UserRef) => {
    if (!found || caret === null) return;
    const after = value.slice(caret);
    const inserted = `@${member.displayName}${after.startsWith(' ') ? '' : ' '}`;
    const next = value.slice(0, found.start) + inserted + after;
    const at = found.start + inserted.length + (after.startsWith(' ') ? 1 : 0);
    pendingCaret.current = at;
    setCaret(at);
    setActive(0);
    onChange(next);
    onPick(member);
  };

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if (!open || !found) return;
    if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
      e.preventDefault();
      const step = e.key === 'ArrowDown' ? 1 : options.length - 1;
      setActive((current + step) % options.length);
    } else if (e.key === 'Enter' || e.key === 'Tab') {
      e.preventDefault();
      pick(options[current]);
    } else if (e.key === 'Escape') {
      e.preventDefault();
      e.stopPropagation();
      setDismissed(`${found.start}:${found.query}`);
    }
  };

  const optionId = (i: number) => `${listId}-option-${i}`;
  return (
    <div>
      <TextField
        label={label}
        value={value}
        multiline
        fullWidth
        minRows={minRows}
        autoFocus={autoFocus}
        disabled={disabled}
        error={error}
        helperText={helperText}
        inputRef={inputRef}
        onChange={(e) => {
          setCaret(e.target.selectionStart);
          setActive(0);
          onChange(e.target.value);
        }}
        onKeyDown={onKeyDown}
        onBlur={() => setCaret(null)}
        slotProps={{
          htmlInput: {
            onSelect: trackCaret,
            'aria-autocomplete': 'list',
            'aria-controls': open ? listId : undefined,
            'aria-activedescendant': open ? optionId(current) : undefined,
          },
        }}
      />
      {open && (
        <Paper elevation={3} sx={{ mt: 0.5 }}>
          <List id={listId} role="listbox" aria-label="Members to mention" dense disablePadding sx={{ py: 0.5 }}>
          {options.map((m, i) => (
            <ListItemButton
              key={m.id}
              id={optionId(i)}
              role="option"
              aria-selected={i === current}
              selected={i === current}
              // Keep the focus (and the caret) in the text box while clicking.
              onMouseDown={(e) => e.preventDefault()}
              onClick={() => pick(m)}
            >
              {m.displayName}
            </ListItemButton>
          ))}
          </List>
        </Paper>
      )}
    </div>
  );
}
