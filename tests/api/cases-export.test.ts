import { agentFor, groupWithRoles, startTestApp, type TestApp } from "./harness";
import { couplingCase, createCase } from "./case-helpers";
import { csvCell, toCsv } from "../../server/csv";

let t: TestApp;
let a: Awaited<ReturnType<typeof groupWithRoles>>;
let b: Awaited<ReturnType<typeof groupWithRoles>>;

beforeAll(async () => {
  t = await startTestApp();
  a = await groupWithRoles(t, "export");
  b = await groupWithRoles(t, "away");
});
afterAll(async () => {
  await t.close();
});

/** A plain RFC 4180 reader, written here so the test does not trust the writer it checks. */
function readCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = "";
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ",") {
      row.push(cell);
      cell = "";
    } else if (ch === "\r" && text[i + 1] === "\n") {
      row.push(cell);
      rows.push(row);
      row = [];
      cell = "";
      i++;
    } else cell += ch;
  }
  return rows;
}

describe("CSV cells", () => {
  it.each([
    ["plain", "plain"],
    ["a, b", '"a, b"'],
    ['say "brine"', '"say ""brine"""'],
    ["two\nlines", '"two\nlines"'],
    ["=1+2", "'=1+2"],
    ["+44 wash", "'+44 wash"],
    ["-20 °C quench", "'-20 °C quench"],
    ["@SUM(A1)", "'@SUM(A1)"],
    ["\t=cmd", "'\t=cmd"],
    ['=HYPERLINK("http://x.invalid","go")', '"\'=HYPERLINK(""http://x.invalid"",""go"")"'],
  ])("%j → %j", (value, expected) => {
    expect(csvCell(value)).toBe(expected);
  });

  it("leaves numbers and empties alone and ends rows with CRLF", () => {
    expect(csvCell(-3)).toBe("-3");
    expect(csvCell(null)).toBe("");
    expect(toCsv([["a", 1], ["b", 2]])).toBe("a,1\r\nb,2\r\n");
  });
});

describe("GET /api/cases/export.csv", () => {
  let resolvedId: string;
  let openId: string;
  beforeAll(async () => {
    resolvedId = (
      await createCase(
        a.chemist.agent,
        couplingCase({
          title: '=HYPERLINK("http://x.invalid","open me")',
          status: "resolved",
          tags: ["amide-coupling", "scale-up"],
          attempts: [{ remedyId: "filter-pad", minutes: 15, outcome: "cleared" }],
        }),
      )
    ).id;
    openId = (await createCase(a.lead.agent, couplingCase({ title: 'Brine, then "salt"\non day two', status: "open" }))).id;
    await createCase(b.owner.agent, couplingCase({ title: "Away group's case" }));
  });

  it("exports the group's filtered list as quoted, injection-safe CSV", async () => {
    const res = await a.chemist.agent.get("/api/cases/export.csv?status=resolved");
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("text/csv; charset=utf-8");
    expect(res.headers["content-disposition"]).toMatch(/attachment; filename="phasewise-cases\.csv"/);
    const rows = readCsv(res.text);
    const header = rows[0]!;
    expect(header.slice(0, 5)).toEqual(["id", "occurred", "title", "status", "author"]);
    expect(rows).toHaveLength(2);
    const row = Object.fromEntries(header.map((h, i) => [h, rows[1]![i]]));
    expect(row).toMatchObject({
      id: resolvedId,
      title: '\'=HYPERLINK("http://x.invalid","open me")',
      status: "resolved",
      author: "export-chemist",
      "organic solvents": "Dichloromethane",
      "aqueous phase": "saturated sodium bicarbonate",
      "solvent family": "halogenated",
      "pH band": "6-9",
      tags: "amide-coupling; scale-up",
      attempts: "1",
      "what worked": "cleared by filtering through diatomaceous earth after 15 min",
      "best outcome": "cleared",
      verified: "no",
    });
  });

  it("keeps commas, quotes and line breaks inside one cell", async () => {
    const rows = readCsv((await a.chemist.agent.get("/api/cases/export.csv?status=open")).text);
    expect(rows).toHaveLength(2);
    expect(rows[1]![0]).toBe(openId);
    expect(rows[1]![2]).toBe('Brine, then "salt"\non day two');
  });

  it("never includes another group's cases, and needs a session", async () => {
    const text = (await a.chemist.agent.get("/api/cases/export.csv")).text;
    expect(readCsv(text)).toHaveLength(3);
    expect(text).not.toContain("Away group");
    expect((await agentFor(t.app).get("/api/cases/export.csv")).status).toBe(401);
    expect((await a.chemist.agent.get("/api/cases/export.csv?outcome=fixed")).status).toBe(400);
  });
});
