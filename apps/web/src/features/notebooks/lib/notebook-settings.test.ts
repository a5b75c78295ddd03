import { describe, expect, it } from 'vitest';
import { formFieldOf, parseTagInput, settingsChanges, settingsFormOf, settingsProblems } from './notebook-settings';

const start = settingsFormOf({ title: 'Sixes', summary: 'Gaps of 6.', tags: ['wheel', 'gaps'], requiredSignoffs: 1 });

describe('notebook settings form', () => {
  it('splits tags on commas and spaces, lower-cased and without duplicates', () => {
    expect(parseTagInput(' Wheel,gaps  twin-primes,, WHEEL ')).toEqual(['wheel', 'gaps', 'twin-primes']);
    expect(parseTagInput('  ')).toEqual([]);
  });

  it('sends only what changed, with the given revision', () => {
    expect(settingsChanges(start, start, 3)).toEqual({ revision: 3 });
    expect(settingsChanges(start, { ...start, tags: 'WHEEL gaps' }, 3)).toEqual({ revision: 3 });
    expect(settingsChanges(start, { ...start, title: ' Sevens ', requiredSignoffs: '3' }, 4)).toEqual({ revision: 4, title: 'Sevens', requiredSignoffs: 3 });
    expect(settingsChanges(start, { ...start, tags: '' }, 4)).toEqual({ revision: 4, tags: [] });
  });

  it("applies the API's limits", () => {
    expect(settingsProblems(start)).toEqual({});
    expect(settingsProblems({ ...start, title: 'x'.repeat(201) }).title).toMatch(/200 characters/);
    expect(settingsProblems({ ...start, title: 'x'.repeat(200) }).title).toBeUndefined();
    expect(settingsProblems({ ...start, tags: Array.from({ length: 21 }, (_, i) => `t${i}`).join(' ') }).tags).toMatch(/at most 20 tags/);
    expect(settingsProblems({ ...start, tags: 'x'.repeat(41) }).tags).toMatch(/at most 40 characters/);
    expect(settingsProblems({ ...start, tags: '-wheel' }).tags).toMatch(/not allowed/);
    expect(settingsProblems({ ...start, tags: 'c++ p#-primorial f_2.1' }).tags).toBeUndefined();
    for (const n of ['0', '21', '1.5', '', '-1']) expect(settingsProblems({ ...start, requiredSignoffs: n }).requiredSignoffs).toBeDefined();
    for (const n of ['1', '20']) expect(settingsProblems({ ...start, requiredSignoffs: n }).requiredSignoffs).toBeUndefined();
  });

  it("maps the API's field names onto the form", () => {
    expect(formFieldOf('tags.2')).toBe('tags');
    expect(formFieldOf('requiredSignoffs')).toBe('requiredSignoffs');
    expect(formFieldOf('revision')).toBeUndefined();
  });
});
