import { BadRequestException } from '@nestjs/common';
import { parse } from '@cribra/lang';

/** "line 2, column 6: '(' is never closed" for every syntax error of a cell's source (empty when it parses). */
export function syntaxErrorsOf(source: string): string[] {
  // Only syntax errors: a cell refused for its size or nesting still runs into its limit error, as before.
  return parse(source).errors
    .filter((e) => e.kind === 'syntax')
    .map((e) => (e.span ? `line ${e.span.line}, column ${e.span.column}: ${e.message}` : e.message));
}

/** Errors written out in the message itself (all of them are in `details`). */
const SHOWN = 5;

/**
 * Refuses (400) a run of a cell that does not parse, listing every syntax error: such a cell is
 * never sent to a runner. `where` names the cell in a notebook-wide run.
 */
export function assertRunnable(sources: Array<{ source: string; where?: string }>): void {
  const details: Array<{ field: string; messages: string[] }> = [];
  for (const { source, where } of sources) {
    const errors = syntaxErrorsOf(source);
    if (errors.length) details.push({ field: where ?? 'source', messages: errors });
  }
  if (!details.length) return;
  const count = details.reduce((n, d) => n + d.messages.length, 0);
  const first = details[0]!;
  const cells = details.length === 1 ? (first.field === 'source' ? 'The cell has' : `${first.field} has`) : `${details.length} cells have`;
  // The message lists them too (the web shows it as it is): the first few, then how many more.
  const all = details.flatMap((d) => d.messages.map((m) => (d.field === 'source' ? m : `${d.field}, ${m}`)));
  const shown = all.slice(0, SHOWN).join('; ') + (all.length > SHOWN ? `; and ${all.length - SHOWN} more` : '');
  throw new BadRequestException({
    message: `${cells} ${count} syntax error${count === 1 ? '' : 's'}; nothing was queued. ${shown}`,
    details,
  });
}
