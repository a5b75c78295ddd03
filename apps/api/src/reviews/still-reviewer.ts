/**
 * SQL condition on a `reviews` row aliased `alias`: its author is (still) a reviewer of the
 * notebook. A sign-off stops counting when its author is removed or given another role.
 */
export function stillReviewer(alias: string): string {
  return `EXISTS (SELECT 1 FROM notebook_members sm
     WHERE sm.notebook_id = ${alias}.notebook_id AND sm.user_id = ${alias}.reviewer_id AND sm.role = 'reviewer')`;
}
