/** npm run typecheck: Expo Router's route types, then tsc --noEmit (scripts/lib/staticChecks.ts). */
import { typecheck } from './lib/staticChecks';

process.exit(typecheck() ? 0 : 1);
