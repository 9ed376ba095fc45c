/** Template ids and their aliases (src/lib/procedure/template-ids.ts): old ids keep working (issue 14). */
import { describe, expect, it } from "vitest";
import { canonicalTemplateId, listedTemplateIds, TEMPLATE_ALIASES, templateAliases, templateIdCandidates } from "../../../src/lib/procedure/template-ids.ts";
import { template } from "./fixtures.ts";

describe("template ids and aliases", () => {
  it("maps the old ids to the ids that say what the template follows", () => {
    expect(TEMPLATE_ALIASES).toEqual({ "four-amendment-legislature": "us-house", "continental-successive": "continental" });
    expect(canonicalTemplateId("continental-successive")).toBe("continental");
    expect(canonicalTemplateId("westminster")).toBe("westminster");
    expect(templateAliases("continental")).toEqual(["continental-successive"]);
  });

  it("tries the current template first, then the id as given, then older names", () => {
    expect(templateIdCandidates("four-amendment-legislature")).toEqual(["us-house", "four-amendment-legislature"]);
    expect(templateIdCandidates("us-house")).toEqual(["us-house", "four-amendment-legislature"]);
    expect(templateIdCandidates("general-parliamentary-law")).toEqual(["general-parliamentary-law"]);
  });

  it("lists a file kept under an old name only while its replacement is absent", () => {
    expect(listedTemplateIds(["continental", "four-amendment-legislature"])).toEqual(["continental", "four-amendment-legislature"]);
    expect(listedTemplateIds(["four-amendment-legislature", "us-house"])).toEqual(["us-house"]);
  });

  it("loads the shipped continental template under its old id", () => {
    expect(template("continental-successive").title).toBe(template("continental").title);
  });
});
