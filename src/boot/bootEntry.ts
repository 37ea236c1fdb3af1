/** The boot script's entry (scripts/lib/bootScript.ts bundles it with the plan of the export it goes with). */
import { earlyStart, type BootPlan } from './earlyStart';

declare const __HEADWATER_BOOT_PLAN__: BootPlan;

try {
  earlyStart(window, __HEADWATER_BOOT_PLAN__);
} catch {
  // nothing here is needed: the app does it all itself when this did not
}
