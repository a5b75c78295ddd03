import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Cells get an optional title (shown on the cell card; the `.sift` marker line `@@ <kind> <title>`
 * carries it). Not part of the revision digest: renaming a cell leaves its runs and sign-offs valid.
 */
export class CellTitles1797100000000 implements MigrationInterface {
  name = 'CellTitles1797100000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE cells ADD COLUMN title varchar(200)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE cells DROP COLUMN title`);
  }
}
