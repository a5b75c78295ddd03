// Worker thread body: decodes and parses one uploaded file (upload-parse-pool.ts runs it), so a
// large CSV never blocks the API's event loop.
import type { UploadKind } from '@cribra/contracts';
import { decodeText, parseTable, parseTuples, type ParseOutcome } from './upload-parser';

export interface ParseTask {
  kind: UploadKind;
  bytes: Uint8Array;
}

/** `null`: the bytes are not UTF-8 text. */
export default function parseUpload({ kind, bytes }: ParseTask): ParseOutcome | null {
  const text = decodeText(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
  if (text === null) return null;
  return kind === 'tuples' ? parseTuples(text) : parseTable(text);
}
