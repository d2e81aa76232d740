// Configuration read by the MikroORM command line (npx mikro-orm …); the app uses the same one.
import { ormConfig } from "./lib/db/config";

export default ormConfig();
