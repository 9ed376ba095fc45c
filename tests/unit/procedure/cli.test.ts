import { describe, expect, it } from "vitest";
import { join } from "node:path";
import { cliSandbox } from "../../support/cli.ts";
import { rawTemplate, templatePath } from "./fixtures.ts";

const { dir, file, run } = cliSandbox("procedure-cli");

describe("gavelwright rulebook check", () => {
  it("exits 2 on a missing file, a non-JSON file, and a wrong subcommand", async () => {
    expect((await run("rulebook", "check", join(dir, "nope.json"))).code).toBe(2);
    expect((await run("rulebook", "check", file("junk.json", "{ nope"))).code).toBe(2);
    expect((await run("rulebook", "lint", templatePath("general-parliamentary-law"))).code).toBe(2);
  });

  it("exits 2 naming the path of an unknown operator", async () => {
    const rb = rawTemplate("general-parliamentary-law");
    rb.rules[2].conditions.all[1].operator = "outranks";
    const r = await run("rulebook", "check", file("bad-op.json", rb));
    expect(r.code).toBe(2);
    expect(r.err).toContain("rules.2.conditions.all.1.operator");
    expect(r.out).toBe("");
  });

  it("exits 2 on 5 MB of junk", async () => {
    const r = await run("rulebook", "check", file("big.json", "x".repeat(5 * 1024 * 1024 + 10)));
    expect(r.code).toBe(2);
  });

  it("exits 0 with a JSON summary for a template", async () => {
    const r = await run("rulebook", "check", templatePath("general-parliamentary-law"));
    expect(r.code).toBe(0);
    const summary = JSON.parse(r.out);
    // 23 motions of the Order of Precedence and §§11-37, plus filling a blank (§33 p. 149), a nomination and
    // closing nominations (§§25, 66) of Robert's Rules of Order Revised (1915).
    expect(summary).toMatchObject({ valid: true, id: "general-parliamentary-law", motions: 26, migrations: [] });
  });

  it("reads a rulebook saved before reconsiderable named the result, and says what it migrated (RONR 1915 §36)", async () => {
    const rb = rawTemplate("general-parliamentary-law");
    rb.motions[0].reconsiderable = true;
    rb.motions[1].reconsiderable = false;
    const r = await run("rulebook", "check", file("old.json", rb));
    expect(r.code).toBe(0);
    const summary = JSON.parse(r.out);
    expect(summary.migrations).toEqual([
      expect.objectContaining({ path: "motions.0.reconsiderable", from: true, to: "both" }),
      expect.objectContaining({ path: "motions.1.reconsiderable", from: false, to: "neither" }),
    ]);
  });
});

describe("gavelwright moves", () => {
  it("exits 2 on a case without a rulebook or with a bad pending entry", async () => {
    expect((await run("moves", file("no-rb.json", { pending: [] }))).code).toBe(2);
    const r = await run("moves", file("bad-pending.json", { rulebook: "general-parliamentary-law", pending: [{ motion: "main" }, { motion: "quorum-call" }] }));
    expect(r.code).toBe(2);
    expect(r.err).toContain("pending.1.motion");
  });

  it("exits 2 naming a recent vote on a motion the rulebook does not have", async () => {
    const r = await run("moves", file("bad-vote.json", { rulebook: "general-parliamentary-law", pending: [], floor: { votes: [{ motion: "quorum-call", result: "adopted" }] } }));
    expect(r.code).toBe(2);
    expect(r.err).toContain("floor.votes.0.motion");
  });

  // Robert's Rules of Order Revised (1915) §33 p. 134: "To Amend takes precedence of the motion to postpone indefinitely".
  it("answers amend above postpone indefinitely with the question it applies to", async () => {
    const r = await run("moves", file("pi.json", { rulebook: "general-parliamentary-law", pending: [{ motion: "main" }, { motion: "postpone-indefinitely" }] }));
    expect(r.code).toBe(0);
    const amend = (JSON.parse(r.out) as Array<Record<string, unknown>>).find((v) => v.motion === "amend");
    expect(amend).toMatchObject({ inOrder: true, degree: 1, appliesTo: "main" });
  });

  it("prefixes rulebook errors with the case member", async () => {
    const rb = rawTemplate("general-parliamentary-law");
    rb.motions[0].rank = -1;
    const r = await run("moves", file("inline-bad.json", { rulebook: rb, pending: [] }));
    expect(r.code).toBe(2);
    expect(r.err).toContain("rulebook.motions.0.rank");
  });

  // Robert's Rules of Order Revised (1915) §§28, 29, 33, 34: DOMAIN §4 "Procedure" case.
  it("prints one verdict per motion, following the contract, for a rulebook given by relative path", async () => {
    file("gpl.json", rawTemplate("general-parliamentary-law"));
    const r = await run("moves", file("case.json", { rulebook: "gpl.json", pending: [{ motion: "main" }, { motion: "amend", degree: 1 }] }));
    expect(r.code).toBe(0);
    const list = JSON.parse(r.out) as Array<Record<string, unknown>>;
    expect(list).toHaveLength(rawTemplate("general-parliamentary-law").motions.length);
    for (const v of list) {
      expect(Object.keys(v)).toEqual(expect.arrayContaining(["motion", "inOrder", "reasons", "second", "debatable", "amendable", "vote", "reconsiderable"]));
    }
    const by = Object.fromEntries(list.map((v) => [v.motion, v]));
    expect(by["lay-on-table"].inOrder).toBe(true);
    expect(by["postpone-indefinitely"].inOrder).toBe(false);
    expect(by.amend).toMatchObject({ inOrder: true, degree: 2 });
  });
});

describe("template ids in case files", () => {
  it("the former id four-amendment-legislature still names the House template (issue 14 alias), and us-senate loads", async () => {
    const old = await run("moves", file("old-id.json", { rulebook: "four-amendment-legislature", pending: [{ motion: "main" }] }));
    expect(old.code).toBe(0);
    const now = await run("moves", file("new-id.json", { rulebook: "us-house", pending: [{ motion: "main" }] }));
    expect(JSON.parse(old.out)).toEqual(JSON.parse(now.out));
    const senate = await run("moves", file("senate.json", { rulebook: "us-senate", pending: [{ motion: "main" }] }));
    expect(senate.code).toBe(0);
    expect((JSON.parse(senate.out) as Array<{ motion: string; inOrder: boolean }>).find((v) => v.motion === "previous-question")!.inOrder).toBe(false);
  });
});
