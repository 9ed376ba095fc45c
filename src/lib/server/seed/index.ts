/** The whole demo scenario, step by step. Areas append their own steps here. */
import { seedFoundation } from "./foundation.ts";
import { seedMeasures } from "./measures.ts";
import { seedRulebooks } from "./rulebooks.ts";
import { seedEstimates } from "./estimates.ts";
import { seedRulings } from "./rulings.ts";

export async function seedDemo(): Promise<void> {
  await seedFoundation();
  await seedRulebooks();
  await seedMeasures();
  await seedEstimates();
  await seedRulings();
}
