import { describe, expect, it } from "vitest";
import { scaleTable } from "@/components/explore/plots/colour-scale";
import { axisIndex, axisPixel, cellOf, cellRect, mapImage, pointAtPixel, pointOf, type MapLayout } from "@/components/explore/plots/map-layout";
import { CORNERS, gridline, hexCell, nearestPoint, stepToward, ternaryToXY, TRIANGLE_HEIGHT, xyToTernary } from "@/components/explore/plots/ternary";
import { thermalBands } from "@/components/explore/plots/thermal-bands";

const layout: MapLayout = { left: 50, top: 10, width: 300, height: 200, n0: 3, n1: 4 };

describe("map layout", () => {
  it("returns p = i0 · n1 + i1 and back (the grid's point order)", () => {
    for (let p = 0; p < 12; p++) {
      const { i0, i1 } = cellOf(p, 4);
      expect(pointOf(i0, i1, 4)).toBe(p);
    }
    expect(cellOf(5, 4)).toEqual({ i0: 1, i1: 1 });
  });

  it("returns variable 0 across and variable 1 up", () => {
    // 3 columns of 100 px, 4 rows of 50 px; row 0 is the bottom one.
    expect(cellRect(layout, 0, 0)).toEqual({ x: 50, y: 160, w: 100, h: 50 });
    expect(cellRect(layout, 2, 3)).toEqual({ x: 250, y: 10, w: 100, h: 50 });
    expect(pointAtPixel(layout, 60, 205)).toBe(pointOf(0, 0, 4));
    expect(pointAtPixel(layout, 349, 11)).toBe(pointOf(2, 3, 4));
    expect(pointAtPixel(layout, 160, 120)).toBe(pointOf(1, 1, 4));
  });

  it("returns the cell under every pixel centre of every cell", () => {
    for (let p = 0; p < 12; p++) {
      const { i0, i1 } = cellOf(p, 4);
      const r = cellRect(layout, i0, i1);
      expect(pointAtPixel(layout, r.x + r.w / 2, r.y + r.h / 2)).toBe(p);
    }
  });

  it("returns the centre of a value's cell along each axis, rising or falling", () => {
    expect(axisIndex([0, 0.1, 0.2], 0.15)).toBeCloseTo(1.5, 12);
    expect(axisIndex([80, 60, 40], 70)).toBeCloseTo(0.5, 12);
    expect(axisPixel(layout, 0, [0, 0.1, 0.2], 0)).toBe(100);
    expect(axisPixel(layout, 0, [0, 0.1, 0.2], 0.2)).toBe(300);
    expect(axisPixel(layout, 1, [1, 2, 3, 4], 1)).toBe(185);
    expect(axisPixel(layout, 1, [1, 2, 3, 4], 4)).toBe(35);
  });

  it("draws one image pixel per point, variable 1 up, NaN transparent", () => {
    // n0 = 2, n1 = 2: p0 (0,0) p1 (0,1) p2 (1,0) p3 (1,1)
    const img = mapImage(Float64Array.of(0, 1, Number.NaN, 0.5), 2, 2, { min: 0, max: 1 }, scaleTable());
    const table = scaleTable();
    const px = (col: number, row: number) => Array.from(img.slice((row * 2 + col) * 4, (row * 2 + col) * 4 + 4));
    expect(px(0, 1)).toEqual(Array.from(table.slice(0, 4))); // p0 bottom left: lowest colour
    expect(px(0, 0)).toEqual(Array.from(table.slice(255 * 4, 256 * 4))); // p1 top left: highest colour
    expect(px(1, 1)[3]).toBe(0); // p2 refused: transparent
    expect(px(1, 0)).toEqual(Array.from(table.slice(128 * 4, 129 * 4))); // p3: 0.5 → entry 128 (round(127.5))
  });

  describe("edge cases", () => {
    it("returns −1 outside the plot and NaN for a value off the axis", () => {
      expect(pointAtPixel(layout, 49, 100)).toBe(-1);
      expect(pointAtPixel(layout, 350, 100)).toBe(-1);
      expect(pointAtPixel(layout, 100, 210)).toBe(-1);
      expect(axisIndex([0, 1], 2)).toBeNaN();
      expect(axisIndex([0.3], 0.3)).toBe(0);
    });

    it("draws a 100 × 100 map quickly", () => {
      const values = new Float64Array(10_000).map((_, i) => Math.sin(i));
      const t0 = performance.now();
      mapImage(values, 100, 100, { min: -1, max: 1 }, scaleTable());
      expect(performance.now() - t0).toBeLessThan(200);
    });
  });
});

describe("ternary coordinates", () => {
  it("maps each pure component to its corner", () => {
    expect(ternaryToXY(1, 0, 0)).toEqual([0.5, TRIANGLE_HEIGHT]);
    expect(ternaryToXY(0, 1, 0)).toEqual([0, 0]);
    expect(ternaryToXY(0, 0, 1)).toEqual([1, 0]);
    expect(CORNERS).toHaveLength(3);
  });

  it("maps equal shares to the centroid and back, shares summing to 1", () => {
    const [x, y] = ternaryToXY(1 / 3, 1 / 3, 1 / 3);
    expect(x).toBeCloseTo(0.5, 12);
    expect(y).toBeCloseTo(TRIANGLE_HEIGHT / 3, 12);
    for (const s of [
      [0.2, 0.3, 0.5],
      [0.7, 0.1, 0.2],
      [0, 0.45, 0.55],
    ] as const) {
      const back = xyToTernary(...ternaryToXY(s[0], s[1], s[2]));
      expect(back[0] + back[1] + back[2]).toBeCloseTo(1, 12);
      back.forEach((v, i) => expect(v).toBeCloseTo(s[i]!, 12));
    }
  });

  it("returns gridlines of constant share joining two edges", () => {
    const [[x1, y1], [x2, y2]] = gridline(0, 0.5);
    expect(y1).toBeCloseTo(TRIANGLE_HEIGHT / 2, 12);
    expect(y2).toBeCloseTo(TRIANGLE_HEIGHT / 2, 12);
    expect([x1, x2].sort()).toEqual([0.25, 0.75]);
    for (const k of [1, 2] as const) {
      for (const [x, y] of gridline(k, 0.3)) expect(xyToTernary(x, y)[k]).toBeCloseTo(0.3, 12);
    }
  });

  it("returns hexagonal cells that meet their neighbours' cells halfway", () => {
    const d = 0.1;
    const cell = hexCell(0.5, 0.3, d);
    expect(cell).toHaveLength(6);
    // Inradius d/2: the flat sides face the six neighbours at distance d.
    const right = Math.max(...cell.map(([x]) => x));
    expect(right - 0.5).toBeCloseTo(d / 2, 12);
  });

  it("returns the nearest point and the next point in a direction", () => {
    const xs = [0, 1, 2, 1];
    const ys = [0, 0, 0, 1];
    expect(nearestPoint(xs, ys, 0.9, 0.2)).toBe(1);
    expect(nearestPoint(xs, ys, 9, 9, 0.5)).toBe(-1);
    expect(stepToward(xs, ys, 0, 1, 0)).toBe(1);
    expect(stepToward(xs, ys, 1, 0, 1)).toBe(3);
    expect(stepToward(xs, ys, 2, 1, 0)).toBe(2);
  });
});

describe("thermal bands", () => {
  it("merges neighbouring points of one status, edges halfway to the next point", () => {
    // statuses: clear, caution, caution, fail, fail, clear
    const bands = thermalBands([0, 2, 4, 6, 8, 10], Uint8Array.of(0, 1, 1, 2, 2, 0));
    expect(bands).toEqual([
      { status: "caution", from: 1, to: 5, first: 1, last: 2 },
      { status: "fail", from: 5, to: 9, first: 3, last: 4 },
    ]);
  });

  it("returns bands that end at the first and last points, on a falling axis too", () => {
    expect(thermalBands([20, 15, 10, 5], Uint8Array.of(2, 2, 0, 1))).toEqual([
      { status: "fail", from: 12.5, to: 20, first: 0, last: 1 },
      { status: "caution", from: 5, to: 7.5, first: 3, last: 3 },
    ]);
  });

  describe("edge cases", () => {
    it("returns no band for an all-clear sweep and splits a band at a refused point", () => {
      expect(thermalBands([0, 1, 2], Uint8Array.of(0, 0, 0))).toEqual([]);
      const bands = thermalBands([0, 1, 2, 3], Uint8Array.of(2, 3, 2, 2), ["fail", "refused"]);
      expect(bands.map((b) => [b.status, b.first, b.last])).toEqual([
        ["fail", 0, 0],
        ["refused", 1, 1],
        ["fail", 2, 3],
      ]);
    });
  });
});
