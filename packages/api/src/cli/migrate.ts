import 'reflect-metadata';
import { MikroORM } from '@mikro-orm/mariadb';
import { loadConfigOrExit } from '../config/app-config';
import { ormOptions } from '../database/orm-options';

/** A start/deploy step: the API and the worker never migrate on their own. */
async function main(): Promise<void> {
  const orm = await MikroORM.init(ormOptions(loadConfigOrExit(process.env)));
  try {
    const applied = await orm.getMigrator().up();
    console.log(
      applied.length === 0
        ? 'migrate: up to date'
        : `migrate: applied ${applied.map((m) => m.name).join(', ')}`,
    );
  } finally {
    await orm.close();
  }
}

main().catch((error: unknown) => {
  console.error(`migrate: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
