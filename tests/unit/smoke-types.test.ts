import { KnowledgeInputError } from "../../knowledge/types";

describe("KnowledgeInputError", () => {
  it("carries the field and suggestions", () => {
    const e = new KnowledgeInputError("organic[0].solvent", "Unknown solvent", ["dichloromethane"]);
    expect(e.field).toBe("organic[0].solvent");
    expect(e.suggestions).toEqual(["dichloromethane"]);
    expect(e).toBeInstanceOf(Error);
  });
});
