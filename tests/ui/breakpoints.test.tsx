import { layoutFor, WIDE_MIN_PX } from "../../hooks/breakpoints";

describe("layoutFor", () => {
  it.each([
    [320, "phone"],
    [390, "phone"],
    [WIDE_MIN_PX - 1, "phone"],
    [WIDE_MIN_PX, "wide"],
    [1280, "wide"],
    [2560, "wide"],
  ] as const)("%i px wide is a %s layout", (width, expected) => {
    expect(layoutFor(width)).toBe(expected);
  });
});
