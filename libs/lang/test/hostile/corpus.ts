import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

/** Error kinds a hostile program may end in (never ok, never internal). */
export type HostileKind = 'syntax' | 'type' | 'domain' | 'limit';

export interface HostileProgram {
  /** File name without `.sift`. */
  name: string;
  /** The kind of error the program must end in (from its `// expect: KIND — why` first line). */
  expect: HostileKind;
  why: string;
  source: string;
}

export const PROGRAMS_DIR = join(__dirname, 'programs');

// `<<repeat N|text>>` stands for text written N times, so that megabyte lines and deep nesting
// stay readable (and small) in the repository; the expanded source is what the cell receives.
const REPEAT = /<<repeat (\d+)\|([\s\S]*?)>>/g;

export function expand(text: string): string {
  return text.replace(REPEAT, (_, n: string, part: string) => part.repeat(Number(n)));
}

/** Every program of the corpus, sorted by name. */
export function loadCorpus(dir = PROGRAMS_DIR): HostileProgram[] {
  return readdirSync(dir)
    .filter((f) => f.endsWith('.sift'))
    .sort()
    .map((file) => {
      const text = readFileSync(join(dir, file), 'utf8');
      const m = /^\/\/ expect: (syntax|type|domain|limit) — (.+)\n/.exec(text);
      if (!m) throw new Error(`${file}: the first line must be "// expect: KIND — why"`);
      return { name: file.replace(/\.sift$/, ''), expect: m[1] as HostileKind, why: m[2]!, source: expand(text) };
    });
}
