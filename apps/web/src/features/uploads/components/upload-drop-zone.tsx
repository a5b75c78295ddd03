import { Box, Typography } from '@mui/material';
import { type DragEvent, useRef, useState } from 'react';

interface Props {
  onFile: (file: File) => void;
  disabled?: boolean;
  accept: string;
}

/** A drop target that is also a button opening the file chooser (keyboard: Enter or Space). */
export function UploadDropZone({ onFile, disabled, accept }: Props) {
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);
  const drop = (e: DragEvent) => {
    e.preventDefault();
    setOver(false);
    const file = e.dataTransfer.files[0];
    if (file && !disabled) onFile(file);
  };
  return (
    <Box
      role="button"
      tabIndex={disabled ? -1 : 0}
      aria-disabled={disabled}
      aria-label="Upload a file: drop it here or press to choose"
      onClick={() => !disabled && input.current?.click()}
      onKeyDown={(e) => (e.key === 'Enter' || e.key === ' ') && !disabled && (e.preventDefault(), input.current?.click())}
      onDragOver={(e) => {
        e.preventDefault();
        setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={drop}
      sx={{
        border: 2,
        borderStyle: 'dashed',
        borderColor: over ? 'primary.main' : 'divider',
        borderRadius: 1,
        p: 2,
        textAlign: 'center',
        cursor: disabled ? 'default' : 'pointer',
        bgcolor: over ? 'rgba(31,107,92,0.06)' : undefined,
        '&:focus-visible': { outline: '2px solid', outlineColor: 'primary.main' },
      }}
    >
      <Typography>Drop a tuple file (.txt) or a table (.csv) here, or press to choose one.</Typography>
      <input ref={input} type="file" accept={accept} hidden onChange={(e) => e.target.files?.[0] && onFile(e.target.files[0])} />
    </Box>
  );
}
