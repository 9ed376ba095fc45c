/**
 * Words for how an amendment counts in the tree (its `role` from buildTree, docs/rulebook-format.md
 * "Degrees and slots"), shared by the drawing and the printable outline. Pure: no React.
 */
export function roleWords(role: string | null | undefined, underSubstitute?: string | null): string | null {
  switch (role) {
    case "perfecting":
      return "perfecting amendment";
    case "substitute":
      return "substitute";
    case "substitute-for-amendment":
      return "substitute for the amendment (first degree)";
    case "perfecting-under-substitute":
      return `perfects the text under substitute ${underSubstitute ?? ""}`.trim();
    case "amendment-to-amendment":
      return "amendment to the amendment";
    default:
      return null;
  }
}

/** The slot shown to a clerk: the place in the tree where only so many amendments may be pending at once. */
export function slotWords(slot: string | null | undefined): string | null {
  if (!slot) return null;
  const [place, kind] = slot.split("/");
  if (kind === "substitute") return `substitute place of ${place}`;
  if (kind === "perfecting") return `perfecting place of ${place}`;
  return `under ${place}`;
}
