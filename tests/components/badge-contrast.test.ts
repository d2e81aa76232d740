/**
 * Every badge's text against its background meets WCAG 2.1's contrast minimum for normal text
 * (success criterion 1.4.3: 4.5:1; badges are 11 px), computed by the colord library's a11y plugin
 * (npm) from the colours the console's Tailwind configuration defines.
 */
import { colord, extend } from "colord";
import a11yPlugin from "colord/plugins/a11y";
import { describe, expect, it } from "vitest";
import { TONES } from "../../components/ui";
import config from "../../tailwind.config";

extend([a11yPlugin]);

type Shades = string | Record<string, string>;
const palette = config.theme.extend.colors as Record<string, Shades>;

/** `bg-scale-200`, `text-ink-soft`, `text-ok`, `text-white` → the colour it names. */
function colour(utility: string): string {
  const [family, shade = "DEFAULT"] = utility.replace(/^(bg|text)-/, "").split("-");
  if (family === "white") return "#ffffff";
  const shades = palette[family];
  const found = typeof shades === "string" ? shades : shades?.[shade];
  if (!found) throw new Error(`no colour for ${utility}`);
  return found;
}

describe("badge colours", () => {
  it("reads the contrast the way WCAG defines it (black on white 21:1)", () => {
    expect(colord("#000000").contrast("#ffffff")).toBe(21);
  });

  it.each(Object.entries(TONES))("%s: text and background at least 4.5:1", (_state, classes) => {
    const utilities = classes.split(" ");
    const background = utilities.find((u) => u.startsWith("bg-"))!;
    const text = utilities.find((u) => u.startsWith("text-"))!;
    expect(colord(colour(text)).contrast(colour(background))).toBeGreaterThanOrEqual(4.5);
  });
});
