// Ideal-point estimates in a worker thread, with progress and cancellation (src/lib/server/ideal-points/jobs.ts).
import { describe, expect, it } from "vitest";
import { cancelIdealJob, idealJob, idealJobFinished, startIdealJob } from "../../../src/lib/server/ideal-points/jobs.ts";
import { syntheticRollCalls } from "../../../bench/ideal-points-data.ts";

const owner = { userId: "u1", chamberId: "c1" };

describe("ideal-point jobs", () => {
  it("runs to a result in a worker", async () => {
    const job = startIdealJob(owner, { ...syntheticRollCalls(30, 40, 2), bootstrap: 2 });
    expect(job.status).toBe("running");
    await idealJobFinished(job.id);
    const done = idealJob(job.id, owner);
    expect(done.status).toBe("done");
    expect(done.result!.members).toHaveLength(30);
    expect(() => idealJob(job.id, { ...owner, userId: "someone else" })).toThrow(/No such estimate/);
  });
  it("reports bad input as the job's error, naming the field", async () => {
    const job = startIdealJob(owner, { dimensions: 5, votes: [] });
    await idealJobFinished(job.id);
    const failed = idealJob(job.id, owner);
    expect(failed.status).toBe("failed");
    expect(failed.error!.issues.map((i) => i.path)).toContain("dimensions");
  });
  it("reports progress and stops when cancelled", async () => {
    const job = startIdealJob(owner, { ...syntheticRollCalls(200, 600, 3), bootstrap: 200 });
    await expect.poll(() => idealJob(job.id, owner).progress, { timeout: 60_000 }).toBeGreaterThan(0);
    const stopped = await cancelIdealJob(job.id, owner);
    expect(stopped.status).toBe("cancelled");
    expect(stopped.result).toBeNull();
  });
});
