/** The whole demo scenario, step by step. Areas append their own steps here. */
import { seedFoundation } from "./foundation.ts";

export async function seedDemo(): Promise<void> {
  await seedFoundation();
}
