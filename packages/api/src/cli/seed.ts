import 'reflect-metadata';
import { MikroORM } from '@mikro-orm/mariadb';
import { loadConfigOrExit } from '../config/app-config';
import { ormOptions } from '../database/orm-options';
import { seedDatabase } from '../database/seed';
import { PasswordService } from '../users/password.service';

async function main(): Promise<void> {
  const config = loadConfigOrExit(process.env);
  const orm = await MikroORM.init(ormOptions(config));
  try {
    console.log(await seedDatabase(orm.em.fork(), config, new PasswordService()));
  } finally {
    await orm.close();
  }
}

main().catch((error: unknown) => {
  console.error(`seed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
