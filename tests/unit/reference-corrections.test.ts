import { applyCorrections, overrideSubject } from "../../knowledge/contracts/reference-overrides";
import { findSolvent, SHIPPED_REFERENCE } from "../../knowledge/reference";
import { changesBetween } from "../../components/desk/format";

/*
 * A group's corrections applied one by one. Shipped value: dichloromethane 1.3266 g/mL at 20 °C
 * (CRC Handbook, physical constants of organic compounds).
 */

describe("applyCorrections", () => {
  it("applies the corrections that fit, reports the one that does not, and leaves the shipped tables alone", () => {
    const { ref, skipped } = applyCorrections(SHIPPED_REFERENCE, [
      { id: "a", payload: { kind: "solvent-value", solventKey: "dichloromethane", field: "densityGPerMl20C", value: 1.318, source: "lab SDS" } },
      { id: "b", payload: { kind: "solvent-value", solventKey: "no-such-solvent", field: "densityGPerMl20C", value: 1.0, source: "lab" } },
      { id: "c", payload: { kind: "aqueous-point", soluteKey: "sodium-chloride", massFractionPct: 12.5, densityGPerMl: 1.0916, source: "pycnometer" } },
    ]);
    expect(findSolvent("DCM", ref)?.densityGPerMl20C).toEqual({ value: 1.318, source: "lab SDS" });
    expect(findSolvent("DCM", SHIPPED_REFERENCE)?.densityGPerMl20C.value).toBe(1.3266);
    expect(skipped).toEqual([{ id: "b", message: expect.stringContaining("no-such-solvent") }]);
    const nacl = ref.solutes.find((s) => s.key === "sodium-chloride")!;
    expect(nacl.points.value.find((p) => p.massFractionPct === 12.5)?.densityGPerMl).toBe(1.0916);
    expect(SHIPPED_REFERENCE.solutes.find((s) => s.key === "sodium-chloride")!.points.value.some((p) => p.massFractionPct === 12.5)).toBe(false);
  });

  it("returns the same tables when there is nothing to apply", () => {
    expect(applyCorrections(SHIPPED_REFERENCE, []).ref).toBe(SHIPPED_REFERENCE);
  });
});

describe("overrideSubject", () => {
  it.each([
    [{ kind: "solvent-value", solventKey: "toluene", field: "boilingPointC", value: 110.6, source: "s", reason: "r" } as const, "solvent-value:toluene:boilingPointC"],
    [{ kind: "aqueous-point", soluteKey: "sodium-chloride", massFractionPct: 26, densityGPerMl: 1.197, source: "s", reason: "r" } as const, "aqueous-point:sodium-chloride:26"],
  ])("names what a correction replaces: %o", (body, subject) => {
    expect(overrideSubject(body)).toBe(subject);
  });
});

describe("changesBetween", () => {
  it("lists the fields an audit entry changed, nested one level and more", () => {
    expect(
      changesBetween(
        { id: "1", payload: { value: 0.899, source: "A" }, reason: "first" },
        { id: "2", payload: { value: 0.901, source: "A" }, reason: "second" },
      ),
    ).toEqual([
      { path: "id", before: "1", after: "2" },
      { path: "payload.value", before: "0.899", after: "0.901" },
      { path: "reason", before: "first", after: "second" },
    ]);
  });

  it("shows a creation as every field going from nothing to its value", () => {
    expect(changesBetween(null, { status: "pending" })).toEqual([{ path: "status", before: "—", after: "pending" }]);
  });
});
