// The diversion charts (Recharts) render on the server without errors and carry their figures
// in words; the summary is what a reader who cannot see the bars gets.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it, vi } from "vitest";
import { DiversionChart } from "@/components/reports/diversion-chart";
import { chartSummary, type ChartColumn, type ChartSeries } from "@/components/reports/chart-summary";
import { formatFigure } from "@/components/reports/format";
import { MATERIAL_COLOURS as MATERIAL_COLORS } from "@/components/ui/palette";

const SERIES: ChartSeries[] = [
  { key: "leaves", label: "Leaves", color: MATERIAL_COLORS.leaves },
  { key: "straw", label: "Straw", color: MATERIAL_COLORS.straw },
  { key: "compost", label: "Compost", color: MATERIAL_COLORS.compost },
];
const COLUMNS: ChartColumn[] = [
  { label: "Oct 26", values: { leaves: 54.431 } },
  { label: "Nov 26", values: { leaves: 81.647, straw: 53.442 } },
];

describe("the chart's words", () => {
  it("writes kg whole from 100 up, else to one place, and m³ to two places", () => {
    expect(formatFigure(1234.4, "kg")).toBe("1,234");
    expect(formatFigure(54.431, "kg")).toBe("54.4");
    expect(formatFigure(0.1136, "m³")).toBe("0.11");
  });
  it("sums each column and names its materials", () => {
    // 81.647 + 53.442 = 135.089 kg, worked by hand.
    expect(chartSummary(COLUMNS, SERIES, "kg")).toBe("Oct 26: 54.4 kg of leaves; Nov 26: 135 kg (Leaves 81.6, Straw 53.4)");
  });
});

describe("DiversionChart", () => {
  it("renders on the server (as the production page pre-renders it) with its title and summary, in a box of fixed height", () => {
    const errors = vi.spyOn(console, "error").mockImplementation(() => {});
    const warns = vi.spyOn(console, "warn").mockImplementation(() => {});
    const html = renderToStaticMarkup(createElement(DiversionChart, { id: "by-month-kg", title: "Kilograms passed on each month, by material", unit: "kg", columns: COLUMNS, series: SERIES }));
    expect(html).toContain("Kilograms passed on each month, by material");
    expect(html).toContain("Nov 26: 135 kg (Leaves 81.6, Straw 53.4).");
    expect(html).toMatch(/style="width:100%;height:280px"[^>]*data-testid="by-month-kg-chart"/);
    expect(html).toContain('aria-describedby="by-month-kg-summary"');
    expect(errors).not.toHaveBeenCalled();
    errors.mockRestore();
    warns.mockRestore();
  });
});
