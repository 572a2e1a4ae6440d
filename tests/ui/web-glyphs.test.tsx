import { render } from "@testing-library/react-native";
import { Icon as NativeIcon } from "../../components/ui/icon";
import { Icon as WebIcon } from "../../components/ui/icon.web";
import { Mark as NativeMark } from "../../components/ui/mark";
import { Mark as WebMark } from "../../components/ui/mark.web";

type Node = { type: string; props: Record<string, unknown>; children: (Node | string)[] | null };

async function tree(ui: React.ReactElement): Promise<Node> {
  const { toJSON } = await render(ui);
  const json = toJSON();
  if (!json || Array.isArray(json)) throw new Error("expected one root element");
  return json as unknown as Node;
}

function all(node: Node, pick: (n: Node) => boolean): Node[] {
  const kids = (node.children ?? []).filter((c): c is Node => typeof c !== "string");
  return [...(pick(node) ? [node] : []), ...kids.flatMap((k) => all(k, pick))];
}

const pathData = (root: Node) => all(root, (n) => typeof n.props.d === "string").map((n) => n.props.d);

describe("web icons and mark (plain DOM svg)", () => {
  // Path and circle counts read off the glyph drawings: a regression in the shared data changes them.
  it.each([
    ["home", 2, 0],
    ["group", 2, 2],
    ["layers", 2, 0],
    ["plan", 4, 0],
    ["cases", 4, 0],
    ["search", 1, 1],
    ["camera", 1, 1],
  ] as const)("draws %s as one hidden svg with %i paths and %i circles", async (name, paths, circles) => {
    const root = await tree(<WebIcon name={name} size={28} tone="brand" />);
    expect(root.type).toBe("svg");
    expect(root.props).toMatchObject({ width: 28, height: 28, viewBox: "0 0 24 24", "aria-hidden": true });
    expect(all(root, (n) => n.type === "path")).toHaveLength(paths);
    expect(all(root, (n) => n.type === "circle")).toHaveLength(circles);
    // tone "brand" is the theme's #17324D
    for (const n of all(root, (x) => x.type === "path" || x.type === "circle")) expect(n.props.stroke).toBe("#17324D");
  });

  it("draws the same paths as the native icon", async () => {
    for (const name of ["home", "solvents", "desk", "emulsion"] as const) {
      const web = pathData(await tree(<WebIcon name={name} />));
      expect(web.length).toBeGreaterThan(0);
      expect(web).toEqual(pathData(await tree(<NativeIcon name={name} />)));
    }
  });

  it("labels the mark and clips organic over aqueous bands to the drop", async () => {
    const root = await tree(<WebMark size={36} />);
    expect(root.type).toBe("svg");
    expect(root.props).toMatchObject({ width: 36, height: 36, viewBox: "0 0 32 32", "aria-label": "Phasewise" });
    const clip = all(root, (n) => n.type === "clipPath");
    expect(clip.map((n) => n.props.id)).toEqual(["drop"]);
    const [group] = all(root, (n) => n.type === "g");
    expect(group?.props.clipPath).toBe("url(#drop)");
    // organic #D98E2B, aqueous #2C8C99, surface #FFFFFF meniscus
    expect(all(group!, (n) => n.type === "rect").map((n) => n.props.fill)).toEqual(["#D98E2B", "#2C8C99", "#FFFFFF"]);
    expect(pathData(root)).toEqual(pathData(await tree(<NativeMark />)));
  });
});
