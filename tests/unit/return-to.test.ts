import { returnPathOf, safeReturnTo } from "../../components/auth/return-to";

describe("returning to the opened page after sign-in", () => {
  it("keeps a shared layer check's path and inputs", () => {
    expect(returnPathOf("/layers", { o: "DCM:40", a: "NaCl:10%:20" })).toBe("/layers?o=DCM%3A40&a=NaCl%3A10%25%3A20");
  });

  it("does not repeat a dynamic segment as a query parameter", () => {
    expect(returnPathOf("/cases/c-42", { id: "c-42" })).toBe("/cases/c-42");
    expect(returnPathOf("/cases/c-42", { id: "c-42", tab: "photos" })).toBe("/cases/c-42?tab=photos");
  });

  it("has nothing to return to from Home", () => {
    expect(returnPathOf("/", {})).toBeUndefined();
  });

  it("follows only paths on this site", () => {
    expect(safeReturnTo("/layers?o=DCM%3A40")).toBe("/layers?o=DCM%3A40");
    for (const bad of ["https://elsewhere.example/", "//elsewhere.example/x", "/\\elsewhere.example", "javascript:alert(1)", "layers", "/x\n", undefined, 42, ["//a"]]) {
      expect(safeReturnTo(bad)).toBe("/");
    }
  });

  it("never returns to a sign-in page", () => {
    expect(safeReturnTo("/sign-in?next=/layers")).toBe("/");
    expect(safeReturnTo("/reset-password?token=t")).toBe("/");
  });
});
