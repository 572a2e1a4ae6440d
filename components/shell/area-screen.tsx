import { lazy, Suspense, type ComponentType } from "react";
import { Loading } from "../ui/states";

type Areas = typeof import("./areas");

/*
 * The areas load as one chunk the first time one of them opens, so the first screen (sign-in,
 * Home and the shell) does without their code: contracts, unit engine, tables, charts.
 * One import() for all of them, not one per area: the web export moves every module that two
 * lazily loaded chunks share into a common chunk that index.html loads up front.
 */
let areas: Promise<Areas> | undefined;
function loadAreas(): Promise<Areas> {
  areas ??= import("./areas").catch((err: unknown) => {
    areas = undefined; // a failed download is tried again on the next visit
    throw err;
  });
  return areas;
}

/** A route's screen, loaded with the rest of the areas; shows Loading until it arrives. */
export function areaScreen<K extends keyof Areas>(name: K): Areas[K] {
  type AnyProps = Record<string, unknown>;
  const Screen = lazy(async () => ({ default: (await loadAreas())[name] as ComponentType<AnyProps> }));
  function AreaScreen(props: AnyProps) {
    return (
      <Suspense fallback={<Loading />}>
        <Screen {...props} />
      </Suspense>
    );
  }
  AreaScreen.displayName = name;
  // Same props as the screen it stands for.
  return AreaScreen as unknown as Areas[K];
}
