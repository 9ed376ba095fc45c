/**
 * What a filing answers (POST /api/measures/:id/amendments and POST /api/amendments/:id/file): the
 * amendment named in words and the tree check's findings on it. The filing form shows it; the
 * measure page keeps it across the reload that shows the new row, whichever control filed it.
 */
import { z } from "zod";

export const filedSchema = z.object({
  id: z.string(),
  key: z.string(),
  status: z.string(),
  name: z.string().nullable(),
  check: z.object({ degree: z.number().nullable(), findings: z.array(z.object({ severity: z.enum(["error", "warning", "info"]), message: z.string() })) }).nullable(),
});
export type Filed = z.output<typeof filedSchema>;

const keptKey = (measureId: string) => `gw-filed:${measureId}`;

/** Keep the answer for the measure page after the reload. */
export function keepFiled(measureId: string, out: Filed): void {
  sessionStorage.setItem(keptKey(measureId), JSON.stringify(out));
}

/** The answer kept before the reload, once (it is removed as it is read). */
export function takeFiled(measureId: string): Filed | null {
  const kept = sessionStorage.getItem(keptKey(measureId));
  if (!kept) return null;
  sessionStorage.removeItem(keptKey(measureId));
  const parsed = filedSchema.safeParse(JSON.parse(kept));
  return parsed.success ? parsed.data : null;
}
