import { describe, expect, it } from "vitest";
import { escapeHtml, seriesColour, SERIES_COLOURS, tooltipHtml } from "./chart-theme";

describe("tooltipHtml", () => {
  it("escapes labels and values, so a lot name cannot inject markup", () => {
    const html = tooltipHtml("<b>lot</b>", [{ label: "A&B", value: `"x"` }]);
    expect(html).toContain("&lt;b&gt;lot&lt;/b&gt;");
    expect(html).toContain("A&amp;B");
    expect(html).toContain("&quot;x&quot;");
    expect(escapeHtml("it's")).toBe("it&#39;s");
  });
});

describe("seriesColour", () => {
  it("cycles through the palette", () => {
    expect(seriesColour(0)).toBe(SERIES_COLOURS[0]);
    expect(seriesColour(SERIES_COLOURS.length + 1)).toBe(SERIES_COLOURS[1]);
  });
});
