import 'reflect-metadata';
import { join } from 'node:path';
import { DataSource, DataSourceOptions } from 'typeorm';

// Under Jest the code runs from src (.ts), under node from dist (.js); never match the .d.ts files.
const ext = __filename.endsWith('.ts') ? 'ts' : 'js';
const srcRoot = join(__dirname, '..');

/** TypeORM options for a given database URL (entities and migrations found by glob). */
export function makeDataSourceOptions(url: string): DataSourceOptions {
  return {
    type: 'postgres',
    url,
    synchronize: false,
    migrationsRun: false,
    entities: [join(srcRoot, `**/*.entity.${ext}`)],
    migrations: [join(srcRoot, `migrations/*.${ext}`)],
    migrationsTableName: 'migrations',
    logging: ['error', 'warn'],
  };
}

export const dataSourceOptions: DataSourceOptions = makeDataSourceOptions(
  process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:4311/cribra',
);

/** For the TypeORM CLI (`typeorm migration:create` etc.). */
export default new DataSource(dataSourceOptions);
