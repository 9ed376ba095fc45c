// Whether a bundle that scripts/build-cli.mjs made (dist/cli, dist/workers) is as new as the sources it
// was made from. Plain JavaScript, because bin/gavelwright.mjs reads it before anything is compiled.
import { existsSync, readdirSync, statSync } from "node:fs";
import { join } from "node:path";

/** Newest modification time of the .ts files under a folder (0 when it is absent, as in an installed package). */
export function newestSource(dir) {
  if (!existsSync(dir)) return 0;
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true, recursive: true })) {
    if (e.isFile() && e.name.endsWith(".ts")) t = Math.max(t, statSync(join(e.parentPath, e.name)).mtimeMs);
  }
  return t;
}

/** True when `bundle` exists and no source under `root`/src/lib or `root`/src/cli is newer. */
export function bundleIsCurrent(bundle, root) {
  if (!existsSync(bundle)) return false;
  const built = statSync(bundle).mtimeMs;
  return newestSource(join(root, "src", "cli")) <= built && newestSource(join(root, "src", "lib")) <= built;
}
