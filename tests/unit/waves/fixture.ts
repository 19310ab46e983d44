import { bramblegateDocument } from "@/db/seeds/demo/floor-plan";
import { buildLayout, type BuiltLayout } from "@/lib/layout-versions/build";
import { demoItems, type DemoItem } from "@/db/seeds/demo/orders";

let built: Promise<{ layout: BuiltLayout; items: DemoItem[] }> | undefined;

/** The demo floor plan built once per test file, with the demo item master slotted into it. */
export function demoLayout(): Promise<{ layout: BuiltLayout; items: DemoItem[] }> {
  built ??= (async () => {
    const doc = bramblegateDocument();
    return { layout: await buildLayout(doc), items: demoItems(doc) };
  })();
  return built;
}
