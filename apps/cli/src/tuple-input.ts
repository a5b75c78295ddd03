import { readFileSync } from 'node:fs';
import { CliError } from './cli-error';
import { parseInteger, parseIntegerList } from './numbers';
import type { ParsedFlags } from './options';

/**
 * The integers of a tuple file: one integer per line; blank lines and lines starting with `#` are
 * ignored; any order. Integers take the forms of {@link parseInteger}.
 * @throws CliError when the file cannot be read or a line is not an integer (naming the line).
 */
export function readTupleFile(path: string): bigint[] {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    throw new CliError(`cannot read ${path}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`);
  }
  const out: bigint[] = [];
  text.split(/\r?\n/).forEach((line, i) => {
    const t = line.trim();
    if (t === '' || t.startsWith('#')) return;
    out.push(parseInteger(t, `${path}:${i + 1}`));
  });
  if (out.length === 0) throw new CliError(`${path}: no integers in the file`);
  return out;
}

/**
 * The tuple given by `--<listFlag> 0,2,6` (or `--tuple`, the glossary's name, where the command's
 * flag is `--pattern`) or `--file PATH` (exactly one of them).
 * Duplicates are reported here, naming the value.
 * @throws CliError otherwise.
 */
export function tupleFromFlags(flags: ParsedFlags, listFlag: string): bigint[] {
  const names = listFlag === 'tuple' ? ['tuple'] : [listFlag, 'tuple'];
  const given = names.filter((n) => typeof flags[n] === 'string');
  const file = flags.file;
  if (given.length > 1) throw new CliError(`give either --${listFlag} or --tuple (the same thing), not both`);
  const list = given.length ? flags[given[0]!] : undefined;
  if (typeof list === 'string' && typeof file === 'string') throw new CliError(`give either --${given[0]} or --file, not both`);
  let values: bigint[];
  if (typeof list === 'string') values = parseIntegerList(list, `--${given[0]}`);
  else if (typeof file === 'string') values = readTupleFile(file);
  else throw new CliError(`missing --${listFlag} (or --file)`);
  const seen = new Set<bigint>();
  for (const v of values) {
    if (seen.has(v)) throw new CliError(`duplicate offset ${v} in the tuple`);
    seen.add(v);
  }
  return values;
}
