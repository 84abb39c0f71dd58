/** SVG path strings (paths.ts). Expected strings are the computed geometry of the inputs. */
import { describe, expect, it } from "vitest";
import { scaleLinear } from "d3-scale";
import { bandPath, clamp, crossPath, diamond, linePath, r1 } from "./paths.ts";

const id = scaleLinear(); // identity: domain [0, 1] → range [0, 1]
const x = scaleLinear().domain([0, 800]).range([56, 702]);
const y = scaleLinear().domain([0, 50]).range([322, 22]);

describe("paths", () => {
  it("a line through two points (d3-shape line; 720 → 56 + 0.9·646 = 637.4 px, 40 m → 82 px, 20 m → 202 px)", () => {
    expect(
      linePath(
        [
          { flow: 0, y: 40 },
          { flow: 720, y: 20 },
        ],
        x,
        y,
      ),
    ).toBe("M56,82L637.4,202");
  });
  it("an empty series draws nothing (empty string, never 'null')", () => {
    expect(linePath([], id, id)).toBe("");
    expect(bandPath([], id, id)).toBe("");
  });
  it("a band goes along the top edge and back along the bottom (d3-shape area)", () => {
    expect(
      bandPath(
        [
          { flow: 0, y0: 1, y1: 2 },
          { flow: 3, y0: 4, y1: 5 },
        ],
        id,
        id,
      ),
    ).toBe("M0,2L3,5L3,4L0,1Z");
  });
  it("the BEP diamond has its corners r away on each axis (computed geometry)", () => {
    expect(diamond(10, 20, 5)).toBe("M10,15L15,20L10,25L5,20Z");
    expect(diamond(10.04, 20.06, 5.5)).toBe("M10,14.6L15.5,20.1L10,25.6L4.5,20.1Z");
  });
  it("the duty cross has four arms from inner to outer, open in the middle (computed geometry)", () => {
    expect(crossPath(9, 9, 2, 8.5)).toBe("M0.5,9H7M11,9H17.5M9,0.5V7M9,11V17.5");
  });
  it("r1 rounds to 0.1 px and clamp limits to a range (by construction)", () => {
    expect(r1(12.345)).toBe(12.3);
    expect(r1(12.35)).toBe(12.4);
    expect(clamp(5, 0, 3)).toBe(3);
    expect(clamp(-1, 0, 3)).toBe(0);
    expect(clamp(2, 0, 3)).toBe(2);
  });
});
