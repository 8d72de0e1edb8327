import { loadConfigOrExit } from './config/app-config';
import { ormOptions } from './database/orm-options';

/** Read by the MikroORM CLI only; the application builds its options from AppConfig. */
export default ormOptions(loadConfigOrExit(process.env));
