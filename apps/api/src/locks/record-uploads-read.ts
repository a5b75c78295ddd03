import { parse } from '@cribra/lang';

/**
 * Names of the uploads a cell's source reads: every `upload("name")` call with a literal name.
 * When a call names its upload by an expression (or the source does not parse but mentions
 * `upload`), every upload of the notebook counts as read — a record would rather carry one file
 * too many than miss one.
 */
export function uploadsRead(source: string, notebookUploads: readonly string[]): string[] {
  if (!/\bupload\b/.test(source)) return [];
  const { program, errors } = parse(source);
  if (errors.length || !program) return [...notebookUploads];
  const names = new Set<string>();
  let dynamic = false;
  const visit = (node: unknown): void => {
    if (!node || typeof node !== 'object') return;
    if (Array.isArray(node)) {
      node.forEach(visit);
      return;
    }
    const n = node as { t?: string; name?: string; args?: Array<{ t: string; value?: unknown }> };
    if (n.t === 'call' && n.name === 'upload') {
      const a = n.args?.[0];
      if (a?.t === 'str' && typeof a.value === 'string') names.add(a.value);
      else dynamic = true;
    }
    for (const [k, v] of Object.entries(node)) if (k !== 'span' && k !== 'nameSpan') visit(v);
  };
  visit(program);
  if (dynamic) return [...notebookUploads];
  return [...names].filter((n) => notebookUploads.includes(n)).sort();
}
