import 'reflect-metadata';
import { MikroORM } from '@mikro-orm/mariadb';
import { loadConfigOrExit } from '../config/app-config';
import { ormOptions } from '../database/orm-options';
import { DEMO_TEAM_NAME, seedDatabase } from '../database/seed';
import { seedDemoScenario } from '../demo/demo-scenario';
import { PasswordService } from '../users/password.service';

async function main(): Promise<void> {
  const config = loadConfigOrExit(process.env);
  const orm = await MikroORM.init(ormOptions(config));
  try {
    console.log(await seedDatabase(orm.em.fork(), config, new PasswordService()));
    if (config.demo) console.log(await seedDemoScenario(orm.em.fork(), DEMO_TEAM_NAME));
  } finally {
    await orm.close();
  }
}

main().catch((error: unknown) => {
  console.error(`seed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
