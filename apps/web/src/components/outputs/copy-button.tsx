import CheckIcon from '@mui/icons-material/Check';
import ContentCopyIcon from '@mui/icons-material/ContentCopy';
import { IconButton, Tooltip } from '@mui/material';
import { useState } from 'react';

interface Props {
  /** The exact text put on the clipboard (no digit-group spaces). */
  text: string;
  label?: string;
}

export function CopyButton({ text, label = 'Copy exact value' }: Props) {
  const [copied, setCopied] = useState<'yes' | 'failed' | null>(null);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(text);
      setCopied('yes');
    } catch {
      setCopied('failed');
    }
    window.setTimeout(() => setCopied(null), 1500);
  };
  const title = copied === 'yes' ? 'Copied' : copied === 'failed' ? 'Copy refused by the browser' : label;
  return (
    <Tooltip title={title}>
      <IconButton size="small" aria-label={label} onClick={copy}>
        {copied === 'yes' ? <CheckIcon fontSize="inherit" /> : <ContentCopyIcon fontSize="inherit" />}
      </IconButton>
    </Tooltip>
  );
}
