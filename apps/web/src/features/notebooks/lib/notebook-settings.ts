import {
  NOTEBOOK_SUMMARY_MAX,
  NOTEBOOK_TAG_MAX,
  NOTEBOOK_TAGS_MAX,
  NOTEBOOK_TITLE_MAX,
  type NotebookSummary,
  type UpdateNotebookBody,
} from '@cribra/contracts';

// Mirrors the API's notebook DTO (apps/api/src/notebooks/dto/create-notebook.dto.ts) for early feedback;
// the API stays the judge. Tags are stored lower-cased, so the pattern is checked on the lower-cased tag.
const TAG_PATTERN = /^[a-z0-9][a-z0-9#+._-]*$/;
export const SIGNOFFS_MIN = 1;
export const SIGNOFFS_MAX = 20;

/** What the settings form holds, as typed. */
export interface NotebookSettingsForm {
  title: string;
  summary: string;
  /** Tags separated by commas or spaces. */
  tags: string;
  requiredSignoffs: string;
}

export type NotebookSettingsField = keyof NotebookSettingsForm;
export type NotebookSettingsProblems = Partial<Record<NotebookSettingsField, string>>;

/** Splits tag input on commas and white space; trimmed, lower-cased, without duplicates (as the API stores them). */
export function parseTagInput(text: string): string[] {
  return [...new Set(text.split(/[\s,]+/).map((t) => t.trim().toLowerCase()).filter(Boolean))];
}

export function settingsFormOf(nb: Pick<NotebookSummary, 'title' | 'summary' | 'tags' | 'requiredSignoffs'>): NotebookSettingsForm {
  return { title: nb.title, summary: nb.summary, tags: nb.tags.join(', '), requiredSignoffs: String(nb.requiredSignoffs) };
}

/** Why these tags would be refused, in plain words; undefined when they are fine. */
export function tagProblem(tags: string[]): string | undefined {
  if (tags.length > NOTEBOOK_TAGS_MAX) return `Use at most ${NOTEBOOK_TAGS_MAX} tags (there are ${tags.length}).`;
  const long = tags.find((t) => t.length > NOTEBOOK_TAG_MAX);
  if (long) return `Tag “${long.slice(0, 12)}…” is too long: at most ${NOTEBOOK_TAG_MAX} characters per tag.`;
  const bad = tags.find((t) => !TAG_PATTERN.test(t));
  if (bad) return `Tag “${bad}” is not allowed: tags use letters, digits and # + . _ - and start with a letter or digit.`;
  return undefined;
}

/** Client-side problems per field, in plain words; empty when the form can be sent. */
export function settingsProblems(form: NotebookSettingsForm): NotebookSettingsProblems {
  const out: NotebookSettingsProblems = {};
  const title = form.title.trim();
  if (!title) out.title = 'Give the notebook a title.';
  else if (title.length > NOTEBOOK_TITLE_MAX) out.title = `Keep the title to ${NOTEBOOK_TITLE_MAX} characters (it has ${title.length}).`;
  const summary = form.summary.trim();
  if (summary.length > NOTEBOOK_SUMMARY_MAX) out.summary = `Keep the summary to ${NOTEBOOK_SUMMARY_MAX} characters (it has ${summary.length}).`;
  const tags = tagProblem(parseTagInput(form.tags));
  if (tags) out.tags = tags;
  const n = form.requiredSignoffs.trim();
  if (!/^\d+$/.test(n) || Number(n) < SIGNOFFS_MIN || Number(n) > SIGNOFFS_MAX) {
    out.requiredSignoffs = `Enter a whole number from ${SIGNOFFS_MIN} to ${SIGNOFFS_MAX}.`;
  }
  return out;
}

const sameTags = (a: string[], b: string[]) => a.length === b.length && a.every((t, i) => t === b[i]);

/**
 * The PATCH body for a valid form: only the fields that differ from `start` (what the form opened with),
 * so applying it onto a newer revision does not undo someone else's change to a field left alone.
 */
export function settingsChanges(start: NotebookSettingsForm, form: NotebookSettingsForm, revision: number): UpdateNotebookBody {
  const body: UpdateNotebookBody = { revision };
  if (form.title.trim() !== start.title.trim()) body.title = form.title.trim();
  if (form.summary.trim() !== start.summary.trim()) body.summary = form.summary.trim();
  const tags = parseTagInput(form.tags);
  if (!sameTags(tags, parseTagInput(start.tags))) body.tags = tags;
  const signoffs = Number(form.requiredSignoffs.trim());
  if (signoffs !== Number(start.requiredSignoffs)) body.requiredSignoffs = signoffs;
  return body;
}

/** Maps the API's 400 field names onto the form's fields ('tags.0' → tags). */
export function formFieldOf(apiField: string): NotebookSettingsField | undefined {
  const root = apiField.split('.')[0];
  return root === 'title' || root === 'summary' || root === 'tags' || root === 'requiredSignoffs' ? root : undefined;
}
