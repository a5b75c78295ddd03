import { describe, expect, it } from 'vitest';
import { levelPlan } from './level-plan';

describe('levelPlan', () => {
  it('names the route of each level the runners store, up to 47', () => {
    expect(levelPlan(13)).toMatch(/enumerated in one piece/);
    expect(levelPlan(31)).toMatch(/recursions/);
    expect(levelPlan(37)).toMatch(/recursions/);
    expect(levelPlan(41)).toMatch(/split route — chunks of the members of 19#/);
    expect(levelPlan(47)).toMatch(/members of 23#.*φ\(47#\)/);
  });
  it('has no plan past 47', () => expect(levelPlan(53)).toBeNull());
});
